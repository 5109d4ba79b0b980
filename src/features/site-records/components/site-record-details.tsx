import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { RetuneResponse, SiteRecord } from '../../../../shared/contracts/site-records';
import { isManualTuning, type Variant, type VariantTuning } from '../../../../shared/contracts/variants';
import { tuningMethods } from '../../../../shared/engine/types';
import { DecayChart, SpectrumChart, TimeHistoryChart } from '../../../components/charts/lazy-charts';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { QueryError } from '../../../components/ui/query-error';
import { Table, Td, Th } from '../../../components/ui/table';
import { describeError, issueMessage, issuesFor } from '../../../lib/api-client';
import { formatDateTime, formatNumber, formatPercent, formatQuantity, formatSignedNumber } from '../../../lib/format';
import { siteRecordTimeHistoryQueryOptions, useAnalyseSiteRecord, useCreateRetunedVariant, useDeleteSiteRecord, useRetune } from '../api/site-records';
import { conditionLabels, methodLabels, tuningMethodLabels } from './labels';

const orDash = (value: number | null | undefined, show: (v: number) => string) => (value === null || value === undefined ? '—' : show(value));
const signedPercent = (value: number | null) => (value === null ? '—' : `${formatSignedNumber(value, 3)} %`);
const firstIssue = (error: unknown, field: string) => {
  const issue = issuesFor(error, field)[0];
  return issue ? issueMessage(issue) : undefined;
};

function Comparison({ record }: { record: SiteRecord }) {
  const c = record.comparison;
  if (!c) return <p className="text-small text-ink-muted">No design mode chosen for this record, so there is nothing to compare with.</p>;
  return (
    <div className="flex flex-col gap-2">
      <Table caption={`Measured against the design mode ${c.modeLabel}`}>
        <thead>
          <tr>
            <Th />
            <Th>Design mode ({c.modeLabel})</Th>
            <Th>Measured</Th>
            <Th>Shift</Th>
          </tr>
        </thead>
        <tbody>
          <tr>
            <Td>Frequency</Td>
            <Td>{formatQuantity(c.design.frequencyHz, 'Hz')}</Td>
            <Td>{orDash(c.measured.frequencyHz, (v) => formatQuantity(v, 'Hz'))}</Td>
            <Td>{signedPercent(c.frequencyShiftPercent)}</Td>
          </tr>
          <tr>
            <Td>Damping ratio</Td>
            <Td>{formatPercent(c.design.dampingRatio)}</Td>
            <Td>{orDash(c.measured.dampingRatio, (v) => formatPercent(v))}</Td>
            <Td>{signedPercent(c.dampingShiftPercent)}</Td>
          </tr>
        </tbody>
      </Table>
      {c.addedDamping ? (
        <p className="text-small text-ink">
          Damping the damper adds: <strong>{formatPercent(c.addedDamping.dampingRatio)}</strong> of critical (measured {orDash(c.measured.dampingRatio, (v) => formatPercent(v))}{' '}
          minus {formatPercent(c.addedDamping.referenceDampingRatio)}{' '}
          {c.addedDamping.reference === 'without-damper-record' ? 'measured without the damper on the same mode' : 'assumed for the design mode (no record without the damper yet)'}).
        </p>
      ) : null}
    </div>
  );
}

function AnalyseAgain({ projectId, record }: { projectId: string; record: SiteRecord }) {
  const analyse = useAnalyseSiteRecord(projectId);
  const form = useForm({ defaultValues: { method: record.analysis.methodChosenBy === 'request' ? record.analysis.method : '', lowHz: String(record.analysis.bandHz[0]), highHz: String(record.analysis.bandHz[1]) } });
  const submit = form.handleSubmit((values) =>
    analyse.mutate({
      id: record.id,
      input: {
        version: record.version,
        method: values.method === 'spectrum' || values.method === 'decay' ? values.method : undefined,
        bandHz: values.lowHz && values.highHz ? [Number(values.lowHz), Number(values.highHz)] : undefined,
      },
    }),
  );
  return (
    <form className="flex flex-col gap-3" onSubmit={(event) => void submit(event)} aria-label="Analyse again" noValidate>
      <div className="grid gap-3 sm:grid-cols-3">
        <SelectField label="Method" error={firstIssue(analyse.error, 'method')} {...form.register('method')}>
          <option value="">Chosen from the record</option>
          <option value="spectrum">{methodLabels.spectrum}</option>
          <option value="decay">{methodLabels.decay}</option>
        </SelectField>
        <TextField label="Band from [Hz]" inputMode="decimal" error={firstIssue(analyse.error, 'bandHz')} {...form.register('lowHz')} />
        <TextField label="Band to [Hz]" inputMode="decimal" {...form.register('highHz')} />
      </div>
      {analyse.isError && !issuesFor(analyse.error, 'bandHz').length ? <Notice tone="error">{describeError(analyse.error)}</Notice> : null}
      <div>
        <Button type="submit" tone="secondary" busy={analyse.isPending}>
          Analyse again
        </Button>
      </div>
    </form>
  );
}

function RetuneForm({ projectId, record }: { projectId: string; record: SiteRecord }) {
  const retune = useRetune(projectId);
  const [answer, setAnswer] = useState<RetuneResponse | null>(null);
  const form = useForm({ defaultValues: { massRatio: '0.02', method: 'den-hartog', tmdMassKg: '', springRateNPerM: '', tuningRangeRatio: '' } });
  const number = (text: string) => (text.trim() === '' ? undefined : Number(text));
  const submit = form.handleSubmit(async (values) => {
    try {
      setAnswer(
        await retune.mutateAsync({
          id: record.id,
          input: {
            massRatio: Number(values.massRatio),
            method: values.method as RetuneResponse['method'],
            tmdMassKg: number(values.tmdMassKg),
            springRateNPerM: number(values.springRateNPerM),
            tuningRangeRatio: number(values.tuningRangeRatio) === undefined ? undefined : Number(values.tuningRangeRatio) / 100,
          },
        }),
      );
    } catch {
      setAnswer(null);
    }
  });
  return (
    <div className="flex flex-col gap-3">
      <form className="flex flex-col gap-3" onSubmit={(event) => void submit(event)} aria-label="Re-tune the damper" noValidate>
        <div className="grid gap-3 sm:grid-cols-3">
          <TextField label="Mass ratio μ" inputMode="decimal" error={firstIssue(retune.error, 'massRatio')} {...form.register('massRatio')} />
          <SelectField label="Tuning method" error={firstIssue(retune.error, 'method')} {...form.register('method')}>
            {tuningMethods.map((m) => (
              <option key={m} value={m}>
                {tuningMethodLabels[m] ?? m}
              </option>
            ))}
          </SelectField>
          <TextField label="Damper moving mass [kg]" optional inputMode="decimal" error={firstIssue(retune.error, 'tmdMassKg')} {...form.register('tmdMassKg')} />
          <TextField label="Spring rate as built [N/m]" optional inputMode="decimal" error={firstIssue(retune.error, 'springRateNPerM')} {...form.register('springRateNPerM')} />
          <TextField label="Tuning range [± %]" optional inputMode="decimal" error={firstIssue(retune.error, 'tuningRangeRatio')} {...form.register('tuningRangeRatio')} />
        </div>
        {retune.isError && issuesFor(retune.error, '').length === 0 && !firstIssue(retune.error, 'massRatio') ? <Notice tone="error">{describeError(retune.error)}</Notice> : null}
        <div>
          <Button type="submit" tone="secondary" busy={retune.isPending}>
            Re-tune to the measured structure
          </Button>
        </div>
      </form>
      {answer ? (
        <dl className="grid gap-x-6 gap-y-1 text-small sm:grid-cols-2" aria-label="Re-tune result">
          <dt className="text-ink-muted">Measured structure</dt>
          <dd>
            {formatQuantity(answer.measured.frequencyHz, 'Hz')}, ζ {formatPercent(answer.measured.dampingRatio)}
          </dd>
          <dt className="text-ink-muted">Damper frequency ({tuningMethodLabels[answer.method]})</dt>
          <dd>
            <strong>{formatQuantity(answer.targetFrequencyHz, 'Hz')}</strong> (ratio {formatNumber(answer.frequencyRatio, 4)}), damper ζ {formatPercent(answer.targetDampingRatio)}
          </dd>
          <dt className="text-ink-muted">Damper frequency as built</dt>
          <dd>{orDash(answer.currentFrequencyHz, (v) => formatQuantity(v, 'Hz'))}</dd>
          <dt className="text-ink-muted">Spring rate at the same mass</dt>
          <dd>
            {orDash(answer.springRateAtSameMassNPerM, (v) => formatQuantity(v, 'N/m'))}
            {answer.springRateChangeRatio !== null ? ` (${signedPercent(answer.springRateChangeRatio * 100)})` : ''}
          </dd>
          <dt className="text-ink-muted">Mass at the same springs</dt>
          <dd>
            {orDash(answer.massAtSameSpringsKg, (v) => formatQuantity(v, 'kg'))}
            {answer.massChangeRatio !== null ? ` (${signedPercent(answer.massChangeRatio * 100)})` : ''}
          </dd>
          <dt className="text-ink-muted">Within the tuning range</dt>
          <dd>
            {answer.withinTuningRange === null
              ? 'Give the mass, the spring rate and the range to check'
              : answer.withinTuningRange
                ? `Yes: a change of ${signedPercent((answer.frequencyChangeRatio ?? 0) * 100)}`
                : `No: a change of ${signedPercent((answer.frequencyChangeRatio ?? 0) * 100)} is outside ±${formatNumber((answer.tuningRangeRatio ?? 0) * 100, 3)} %`}
          </dd>
        </dl>
      ) : null}
    </div>
  );
}

/** A tuning variant the re-tuned variant may copy (the route reads the project's variants). */
export interface RetuneVariantChoice {
  id: string;
  name: string;
  modeId: string;
  tuning: VariantTuning;
}

/** What the route gives an editor's record panel for a re-tuned variant. */
export interface RetunedVariantOptions {
  /** The project's variants; null while they load. */
  choices: RetuneVariantChoice[] | null;
  error: unknown;
  retry: () => void;
  /** Called with the new variant (the route refreshes the variants). */
  onCreated: (variant: Variant) => void;
}

/** Editors: a new tuning variant, a copy of one on the record's mode with its damper re-tuned to the measured structure. */
function RetunedVariantForm({ projectId, record, options }: { projectId: string; record: SiteRecord; options: RetunedVariantOptions }) {
  const create = useCreateRetunedVariant(projectId);
  const [made, setMade] = useState<Variant | null>(null);
  const form = useForm({ defaultValues: { variantId: '', name: '' } });
  const onMode = (options.choices ?? []).filter((variant) => variant.modeId === record.modeId);
  const submit = form.handleSubmit(async (values) => {
    try {
      const variant = await create.mutateAsync({ id: record.id, input: { variantId: values.variantId, name: values.name.trim() === '' ? undefined : values.name } });
      setMade(variant);
      options.onCreated(variant);
    } catch {
      setMade(null);
    }
  });
  if (options.error) return <QueryError error={options.error} retry={options.retry} what="the tuning variants" />;
  if (options.choices === null) return <Loading label="Loading the tuning variants…" />;
  const modeLabel = record.comparison?.modeLabel ?? 'this record’s mode';
  return (
    <div className="flex flex-col gap-3">
      <p className="text-small text-ink-soft">
        A new variant copying a variant on {modeLabel} (load cases, criteria, mass ratio, units, tolerances, hardware), with its damper set by hand to what the variant’s tuning
        method gives for the structure as measured here. Its result is computed on the design mode as stored: it checks the as-built damper on the design model, not on
        the structure as measured. The original variant is left as it is.
      </p>
      {onMode.length === 0 ? (
        <p className="text-small text-ink-muted">No tuning variant is on {modeLabel} yet.</p>
      ) : (
        <form className="flex flex-col gap-3" onSubmit={(event) => void submit(event)} aria-label="Create a re-tuned variant" noValidate>
          <div className="grid gap-3 sm:grid-cols-2">
            <SelectField label="Variant to re-tune" error={firstIssue(create.error, 'variantId')} {...form.register('variantId', { required: true })}>
              <option value="">Choose a variant</option>
              {onMode.map((variant) => (
                <option key={variant.id} value={variant.id} disabled={isManualTuning(variant.tuning)}>
                  {variant.name}
                  {isManualTuning(variant.tuning) ? ' (tuned by hand: no method to re-tune by)' : ` (${tuningMethodLabels[variant.tuning.method] ?? variant.tuning.method})`}
                </option>
              ))}
            </SelectField>
            <TextField label="Name of the new variant" optional error={firstIssue(create.error, 'name')} {...form.register('name')} />
          </div>
          {form.formState.errors.variantId ? <p className="text-caption text-signal-error">Choose the variant to re-tune.</p> : null}
          {create.isError && !firstIssue(create.error, 'variantId') && !firstIssue(create.error, 'name') ? <Notice tone="error">{describeError(create.error)}</Notice> : null}
          <div>
            <Button type="submit" tone="secondary" busy={create.isPending}>
              Create a re-tuned variant
            </Button>
          </div>
        </form>
      )}
      {made ? (
        <Notice tone="success" title="Re-tuned variant created">
          <p>
            <Link to={`/projects/${projectId}/tuning-variants/${made.id}`} className="font-medium underline underline-offset-4">
              {made.name}
            </Link>
            {isManualTuning(made.tuning) ? `: damper ${formatQuantity(made.tuning.frequencyHz, 'Hz')}, ζ ${formatPercent(made.tuning.dampingRatio)} (referred to its own frequency), set by hand` : ''}. Its
            result is computed on the design mode as stored: the as-built damper on the design model.
          </p>
        </Notice>
      ) : null}
    </div>
  );
}

function Plots({ projectId, record }: { projectId: string; record: SiteRecord }) {
  const history = useQuery(siteRecordTimeHistoryQueryOptions(projectId, record.id, record.version));
  const a = record.analysis;
  const peakIndex = a.spectrum.peakFrequencyHz === null ? -1 : a.spectrum.frequencyHz.findIndex((f) => f >= (a.spectrum.peakFrequencyHz as number));
  const peak = peakIndex >= 0 ? { frequencyHz: a.spectrum.peakFrequencyHz as number, psd: a.spectrum.psdM2PerS4PerHz[peakIndex] } : null;
  return (
    <div className="grid gap-6 lg:grid-cols-2">
      {history.isPending ? (
        <Loading label="Loading the time history…" />
      ) : history.isError ? (
        <QueryError error={history.error} retry={() => void history.refetch()} what="the time history" />
      ) : (
        <TimeHistoryChart
          timesS={history.data.timesS}
          series={[{ label: `${history.data.channel} [m/s²]`, values: history.data.accelerationMPerS2 }]}
          valueAxisLabel="acceleration [m/s²]"
          description={`Time history of ${history.data.channel}, ${history.data.sampleCount} samples at ${formatNumber(history.data.sampleRateHz, 4)} Hz${history.data.thinned ? ' (plotted as each stretch’s lowest and highest sample)' : ''}.`}
        />
      )}
      <SpectrumChart
        frequencyHz={a.spectrum.frequencyHz}
        psd={a.spectrum.psdM2PerS4PerHz}
        fit={a.spectrumFit ? { frequencyHz: a.spectrumFit.curve.frequencyHz, psd: a.spectrumFit.curve.psdM2PerS4PerHz } : null}
        peak={peak}
        description={`Spectrum: Welch PSD, Hann window, ${a.spectrum.segmentCount} segments, resolution ${formatNumber(a.spectrum.resolutionHz, 3)} Hz; band searched ${formatNumber(a.bandHz[0], 3)}–${formatNumber(a.bandHz[1], 3)} Hz.`}
      />
      {a.decay ? (
        <DecayChart
          envelope={{ timesS: a.decay.timesS, values: a.decay.envelopeMPerS2 }}
          fit={a.decay.fit ? { timesS: a.decay.fit.timesS, values: a.decay.fit.envelopeMPerS2 } : null}
          description={
            a.decay.fit
              ? `Free decay band-passed to ${formatNumber(a.decay.filterBandHz[0], 3)}–${formatNumber(a.decay.filterBandHz[1], 3)} Hz; fit over ${formatNumber(a.decay.fit.startS, 3)}–${formatNumber(a.decay.fit.endS, 3)} s (${formatNumber(a.decay.fit.cycleCount, 3)} cycles, R² ${formatNumber(a.decay.fit.rSquared, 3)}).`
              : 'Free decay envelope; no decay stood clear of the noise.'
          }
        />
      ) : null}
    </div>
  );
}

/** One record: what the analysis found, the plots, the comparison with the design mode, and (for those allowed) a new analysis, the re-tune, a re-tuned variant and deletion. */
export function SiteRecordDetails({
  projectId,
  record,
  canAnalyse,
  canDelete,
  retunedVariant,
}: {
  projectId: string;
  record: SiteRecord;
  canAnalyse: boolean;
  canDelete: boolean;
  /** Only for admins and engineers: a re-tuned variant from this record. */
  retunedVariant?: RetunedVariantOptions;
}) {
  const remove = useDeleteSiteRecord(projectId);
  const [confirming, setConfirming] = useState(false);
  const a = record.analysis;
  return (
    <article className="flex flex-col gap-5" aria-label={`Site record ${record.fileName}`}>
      <div className="flex flex-wrap items-center gap-2">
        <h3 className="text-body font-semibold text-ink">{record.fileName}</h3>
        <Badge>{conditionLabels[record.condition]}</Badge>
        <span className="text-caption text-ink-muted">
          {record.measuredAt ? `measured ${formatDateTime(record.measuredAt)} · ` : ''}
          {record.channel}, {record.sampleCount} samples at {formatNumber(record.sampleRateHz, 4)} Hz ({formatNumber(a.durationS, 3)} s) · version {record.version}
        </span>
      </div>
      {record.notes ? <p className="text-small text-ink-soft">{record.notes}</p> : null}
      <dl className="grid gap-x-6 gap-y-1 text-small sm:grid-cols-3" aria-label="Analysis">
        <div>
          <dt className="text-ink-muted">Frequency</dt>
          <dd className="text-lead font-semibold">{orDash(a.frequencyHz, (v) => formatQuantity(v, 'Hz'))}</dd>
        </div>
        <div>
          <dt className="text-ink-muted">Damping ratio</dt>
          <dd className="text-lead font-semibold">{orDash(a.dampingRatio, (v) => formatPercent(v))}</dd>
        </div>
        <div>
          <dt className="text-ink-muted">Method</dt>
          <dd>{methodLabels[a.method]}</dd>
        </div>
      </dl>
      <p className="text-caption text-ink-muted">{a.methodNote}</p>
      {a.warnings.length > 0 ? (
        <Notice tone="caution" title="Warnings">
          <ul className="list-disc pl-5">
            {a.warnings.map((warning) => (
              <li key={warning}>{warning}</li>
            ))}
          </ul>
        </Notice>
      ) : null}
      <section aria-label="Compared with the design" className="flex flex-col gap-2">
        <h4 className="text-small font-semibold text-ink-soft">Compared with the design</h4>
        <Comparison record={record} />
      </section>
      <Plots projectId={projectId} record={record} />
      {canAnalyse ? (
        <section aria-label="Analyse again" className="flex flex-col gap-2">
          <h4 className="text-small font-semibold text-ink-soft">Analyse again with another band or method</h4>
          <AnalyseAgain projectId={projectId} record={record} />
        </section>
      ) : null}
      {a.frequencyHz !== null && a.dampingRatio !== null && record.condition !== 'with-damper' ? (
        <section aria-label="Re-tune" className="flex flex-col gap-2">
          <h4 className="text-small font-semibold text-ink-soft">Re-tune the damper to the measured structure</h4>
          <RetuneForm projectId={projectId} record={record} />
        </section>
      ) : null}
      {retunedVariant && record.modeId && a.frequencyHz !== null && a.dampingRatio !== null && record.condition !== 'with-damper' ? (
        <section aria-label="Re-tuned variant" className="flex flex-col gap-2">
          <h4 className="text-small font-semibold text-ink-soft">Create a re-tuned variant</h4>
          <RetunedVariantForm projectId={projectId} record={record} options={retunedVariant} />
        </section>
      ) : null}
      {canDelete ? (
        <div className="flex items-center gap-2">
          {confirming ? (
            <>
              <Button tone="danger" busy={remove.isPending} onClick={() => remove.mutate(record.id)}>
                Delete this record and its file
              </Button>
              <Button tone="quiet" onClick={() => setConfirming(false)}>
                Keep it
              </Button>
            </>
          ) : (
            <Button tone="danger-outline" onClick={() => setConfirming(true)}>
              Delete record
            </Button>
          )}
          {remove.isError ? <span className="text-caption text-signal-error">{describeError(remove.error)}</span> : null}
        </div>
      ) : null}
    </article>
  );
}
