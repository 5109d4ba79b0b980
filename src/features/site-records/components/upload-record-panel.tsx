import { useRef, useState, type DragEvent } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { siteRecordConditions, SITE_RECORD_MAX_FILE_BYTES } from '../../../../shared/contracts/site-records';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { describeError, issueMessage, issuesFor } from '../../../lib/api-client';
import { formatQuantity } from '../../../lib/format';
import { useUploadSiteRecord, type UploadProgress } from '../api/site-records';
import { conditionLabels, methodLabels } from './labels';

export interface StructureChoice {
  id: string;
  name: string;
  modes: { id: string; label: string; frequencyHz: number }[];
}

interface FormValues {
  structureId: string;
  modeId: string;
  condition: string;
  method: string;
  bandLowHz: string;
  bandHighHz: string;
  channel: string;
  sampleRateHz: string;
  measuredAt: string;
  notes: string;
}

const firstIssue = (error: unknown, field: string) => {
  const issue = issuesFor(error, field)[0];
  return issue ? issueMessage(issue) : undefined;
};

/** Upload of one record: the file by drag and drop or a file picker, what was measured, and progress while it is sent and analysed. */
export function UploadRecordPanel({ projectId, structures, onUploaded }: { projectId: string; structures: StructureChoice[]; onUploaded: (id: string) => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [fileProblem, setFileProblem] = useState<string | null>(null);
  const [dragging, setDragging] = useState(false);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const upload = useUploadSiteRecord(projectId, setProgress);
  const form = useForm<FormValues>({
    defaultValues: { structureId: structures[0]?.id ?? '', modeId: '', condition: 'without-damper', method: '', bandLowHz: '', bandHighHz: '', channel: '', sampleRateHz: '', measuredAt: '', notes: '' },
  });
  const structureId = useWatch({ control: form.control, name: 'structureId' });
  const modes = structures.find((s) => s.id === structureId)?.modes ?? [];

  const choose = (chosen: File | undefined) => {
    if (!chosen) return;
    setFileProblem(chosen.size > SITE_RECORD_MAX_FILE_BYTES ? `${chosen.name} is larger than 20 MB` : null);
    setFile(chosen);
    upload.reset();
  };
  const onDrop = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    setDragging(false);
    choose(event.dataTransfer.files[0]);
  };

  const submit = form.handleSubmit(async (values) => {
    if (!file) {
      setFileProblem('Choose a file first');
      return;
    }
    const band = values.bandLowHz && values.bandHighHz ? ([Number(values.bandLowHz), Number(values.bandHighHz)] as [number, number]) : undefined;
    setProgress({ sentRatio: 0, analysing: false });
    try {
      const record = await upload.mutateAsync({
        file,
        fields: {
          structureId: values.structureId,
          modeId: values.modeId || undefined,
          condition: values.condition,
          method: values.method || undefined,
          bandHz: band,
          channel: values.channel || undefined,
          sampleRateHz: values.sampleRateHz ? Number(values.sampleRateHz) : undefined,
          measuredAt: values.measuredAt ? new Date(values.measuredAt).toISOString() : undefined,
          notes: values.notes || undefined,
        },
      });
      setFile(null);
      form.reset({ ...values, notes: '' });
      onUploaded(record.id);
    } catch {
      // Shown below from upload.error.
    } finally {
      setProgress(null);
    }
  });

  const fileError = fileProblem ?? firstIssue(upload.error, 'file');
  return (
    <form onSubmit={(event) => void submit(event)} className="flex flex-col gap-4" aria-label="Upload a site record" noValidate>
      <div
        onDragOver={(event) => {
          event.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={`flex flex-col items-center gap-2 rounded-plate border-2 border-dashed px-4 py-6 text-center ${dragging ? 'border-tide-700 bg-tide-50' : 'border-paper-line bg-paper-sunk'}`}
      >
        <p className="text-body text-ink">{file ? `${file.name} (${(file.size / 1024).toFixed(0)} kB)` : 'Drop a CSV file here'}</p>
        <p className="text-caption text-ink-muted">
          A header row, time in s in the first column, then one or more accelerations in m/s² (comma, semicolon or tab separated); or a single column of
          accelerations with its sample rate below. At most 20 MB.
        </p>
        <input ref={input} type="file" accept=".csv,.txt,.tsv,text/csv,text/plain" className="sr-only" id="site-record-file" onChange={(event) => choose(event.target.files?.[0])} />
        <Button tone="secondary" onClick={() => input.current?.click()}>
          Choose a file…
        </Button>
        {fileError ? (
          <p className="text-caption font-medium text-signal-error" role="alert">
            {fileError}
          </p>
        ) : null}
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Structure" error={firstIssue(upload.error, 'structureId')} {...form.register('structureId')}>
          {structures.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </SelectField>
        <SelectField label="Design mode to compare with" optional error={firstIssue(upload.error, 'modeId')} {...form.register('modeId')}>
          <option value="">None</option>
          {modes.map((m) => (
            <option key={m.id} value={m.id}>
              {m.label} ({formatQuantity(m.frequencyHz, 'Hz', 3)})
            </option>
          ))}
        </SelectField>
        <SelectField label="Condition" error={firstIssue(upload.error, 'condition')} {...form.register('condition')}>
          {siteRecordConditions.map((c) => (
            <option key={c} value={c}>
              {conditionLabels[c]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Method" optional hint="Left blank, the record decides (a free decay or an ambient response)." error={firstIssue(upload.error, 'method')} {...form.register('method')}>
          <option value="">Chosen from the record</option>
          <option value="spectrum">{methodLabels.spectrum}</option>
          <option value="decay">{methodLabels.decay}</option>
        </SelectField>
        <TextField label="Band from [Hz]" optional inputMode="decimal" error={firstIssue(upload.error, 'bandHz')} {...form.register('bandLowHz')} />
        <TextField label="Band to [Hz]" optional inputMode="decimal" hint="Default 0.5 Hz to 15 Hz (at most 0.45 × the sample rate)." {...form.register('bandHighHz')} />
        <TextField label="Channel" optional hint="Column name, or 0 for the first acceleration column." error={firstIssue(upload.error, 'channel')} {...form.register('channel')} />
        <TextField label="Sample rate [Hz]" optional hint="Only for a file with a single column." inputMode="decimal" error={firstIssue(upload.error, 'sampleRateHz')} {...form.register('sampleRateHz')} />
        <TextField label="Measured at" optional type="datetime-local" error={firstIssue(upload.error, 'measuredAt')} {...form.register('measuredAt')} />
      </div>
      <TextAreaField label="Notes" optional error={firstIssue(upload.error, 'notes')} {...form.register('notes')} />
      {upload.isError && !fileError ? <Notice tone="error" title="The record was not stored">{describeError(upload.error)}</Notice> : null}
      {progress ? (
        <div className="flex flex-col gap-1" role="status" aria-live="polite">
          <progress className="w-full" max={1} value={progress.analysing ? undefined : (progress.sentRatio ?? undefined)} />
          <p className="text-caption text-ink-muted">
            {progress.analysing ? 'Analysing the record…' : `Sending… ${progress.sentRatio === null ? '' : `${Math.round(progress.sentRatio * 100)} %`}`}
          </p>
        </div>
      ) : null}
      <div>
        <Button type="submit" busy={upload.isPending} disabled={!file || fileProblem !== null}>
          Upload and analyse
        </Button>
      </div>
    </form>
  );
}
