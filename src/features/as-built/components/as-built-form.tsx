import { forwardRef, useMemo, useState, type InputHTMLAttributes } from 'react';
import { get, useForm, type FieldErrors, type Path } from 'react-hook-form';
import { asBuiltInputSchemaFor, type AsBuiltInput, type AsBuiltUnit } from '../../../../shared/contracts/as-built';
import type { AsBuiltDesign } from '../../../../shared/compute/as-built';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { applyServerIssues } from '../../../lib/form-errors';
import { bodyResolver, dropBlank } from '../../../lib/form-resolver';
import { numberOrUndefined } from '../../../lib/form-values';
import { useDisplayUnits } from '../../../lib/display-units';
import { formatNumber } from '../../../lib/format';
import { useRecordAsBuilt } from '../api/as-built';

interface UnitRowValues {
  movingMassKg?: number;
  springRateNPerM?: number;
  frequencyHz?: number;
  measuredAt: string;
  note: string;
}

export interface AsBuiltFormValues {
  units: UnitRowValues[];
  note: string;
}

/** The body the server takes: row i is unit i + 1; what was left blank is left out. */
export function asBuiltBody(values: AsBuiltFormValues): AsBuiltInput {
  const note = values.note.trim();
  return {
    units: values.units.map((row, index) => dropBlank({ unitNumber: index + 1, ...row, note: row.note.trim() }) as AsBuiltInput['units'][number]),
    ...(note ? { note } : {}),
  };
}

/** One row per unit, filled with the latest record's values when there is one (a re-measurement changes what moved). */
function startValues(unitCount: number, latest: AsBuiltUnit[] | undefined): AsBuiltFormValues {
  return {
    units: Array.from({ length: unitCount }, (_, index) => {
      const unit = latest?.find((entry) => entry.unitNumber === index + 1);
      return { movingMassKg: unit?.movingMassKg, springRateNPerM: unit?.springRateNPerM, frequencyHz: unit?.frequencyHz, measuredAt: '', note: '' };
    }),
    note: '',
  };
}

const errorAt = (errors: FieldErrors<AsBuiltFormValues>, path: string): string | undefined => (get(errors, path) as { message?: string } | undefined)?.message;

const cellControl =
  'block w-full min-w-24 rounded-plate border border-paper-line bg-paper-raised px-2.5 py-1.5 text-small text-ink tabular-nums ' +
  'placeholder:text-ink-muted hover:border-ink-muted aria-[invalid=true]:border-2 aria-[invalid=true]:border-signal-error aria-[invalid=true]:bg-signal-error-bg/40';

/** "Moving mass [kg] is required" from the control's label and a rule fragment. */
function sentence(label: string, error: string): string {
  if (!/^[a-z]/.test(error)) return error;
  const what = label.replace(/^Unit \d+, /, '');
  return `${what.charAt(0).toUpperCase()}${what.slice(1)} ${error}`;
}

/** An input inside the table of units, labelled for assistive technology, with its error right below it. */
const CellInput = forwardRef<HTMLInputElement, { label: string; error?: string } & InputHTMLAttributes<HTMLInputElement>>(function CellInput(
  { label, error, id, ...rest },
  ref,
) {
  return (
    <div className="flex flex-col gap-1">
      <input ref={ref} id={id} aria-label={label} aria-invalid={error ? true : undefined} aria-describedby={error ? `${id}-error` : undefined} className={cellControl} {...rest} />
      {error ? (
        <p id={`${id}-error`} className="max-w-56 text-caption font-medium text-signal-error">
          <span aria-hidden="true">✕ </span>
          {sentence(label, error)}
        </p>
      ) : null}
    </div>
  );
});

/**
 * The fabricator's record of the units as built: one row per unit of the hardware sheet, the moving mass required,
 * spring rate and tuned frequency when measured. Checked with the server's own schema before it is sent.
 */
export function AsBuiltForm({ projectId, signOffId, design, latest }: { projectId: string; signOffId: string; design: AsBuiltDesign; latest?: AsBuiltUnit[] }) {
  const record = useRecordAsBuilt(projectId, signOffId);
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const resolver = useMemo(() => bodyResolver<AsBuiltFormValues, ReturnType<typeof asBuiltInputSchemaFor>>(asBuiltInputSchemaFor(design.unitCount), asBuiltBody), [design.unitCount]);
  const { register, handleSubmit, setError, reset, formState } = useForm<AsBuiltFormValues, unknown, unknown>({
    resolver: resolver as never,
    defaultValues: startValues(design.unitCount, latest),
  });
  const errors = formState.errors;
  const rows = Array.from({ length: design.unitCount }, (_, index) => index);
  const serverFields = [
    ...rows.flatMap((i) => (['movingMassKg', 'springRateNPerM', 'frequencyHz', 'measuredAt', 'note', 'unitNumber'] as const).map((f) => `units.${i}.${f}`)),
    'note',
  ] as Path<AsBuiltFormValues>[];

  const onSubmit = handleSubmit((body) => {
    setFormError(null);
    setSaved(false);
    record.mutate(body as AsBuiltInput, {
      onSuccess: (stored) => {
        reset(startValues(design.unitCount, stored.units));
        setSaved(true);
      },
      onError: (error) => setFormError(applyServerIssues(error, serverFields, setError)),
    });
  });

  const id = (i: number, field: string) => `as-built-${signOffId.slice(0, 8)}-${i + 1}-${field}`;
  // The record is typed in SI whatever the person's unit preference; for a US customary reader the labels say so.
  const withUs = useDisplayUnits().system === 'us-customary';
  const si = withUs ? ', SI' : '';
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Record the units as built" className="flex flex-col gap-4">
      {formError ? (
        <Notice tone="error" title="The as-built record was not stored">
          {formError}
        </Notice>
      ) : null}
      {Object.keys(errors).length > 0 && !formError ? (
        <p role="alert" className="text-small font-medium text-signal-error">
          <span aria-hidden="true">✕ </span>Some values need a correction; each is marked next to its field.
        </p>
      ) : null}
      {withUs ? (
        <p className="text-small text-ink-soft">
          This form takes SI units (kg, N/m, Hz), as the hardware sheet&apos;s files do; the comparison shows the US customary
          values beside them.
        </p>
      ) : null}
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left text-small">
          <caption className="sr-only">Measured values per unit, in SI units</caption>
          <thead>
            <tr>
              <th scope="col" className="border-b-2 border-paper-line px-2 py-2 text-caption font-semibold text-ink-muted">
                Unit
              </th>
              <th scope="col" className="border-b-2 border-paper-line px-2 py-2 text-caption font-semibold text-ink-muted">
                Moving mass [kg{si}]
                <span className="block font-normal">design {formatNumber(design.movingMassPerUnitKg, 4)}</span>
              </th>
              <th scope="col" className="border-b-2 border-paper-line px-2 py-2 text-caption font-semibold text-ink-muted">
                Spring rate [N/m{si}] <span className="font-normal">(if measured)</span>
                <span className="block font-normal">design {formatNumber(design.springRatePerUnitNPerM, 4)}</span>
              </th>
              <th scope="col" className="border-b-2 border-paper-line px-2 py-2 text-caption font-semibold text-ink-muted">
                Tuned frequency [Hz{si}] <span className="font-normal">(if measured)</span>
                <span className="block font-normal">
                  design {formatNumber(design.frequencyHz, 4)}, range {formatNumber(design.frequencyLowHz, 3)}–{formatNumber(design.frequencyHighHz, 3)}
                </span>
              </th>
              <th scope="col" className="border-b-2 border-paper-line px-2 py-2 text-caption font-semibold text-ink-muted">
                Measured on <span className="font-normal">(optional)</span>
              </th>
              <th scope="col" className="border-b-2 border-paper-line px-2 py-2 text-caption font-semibold text-ink-muted">
                Note <span className="font-normal">(optional)</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {rows.map((i) => (
              <tr key={i} className="align-top">
                <th scope="row" className="whitespace-nowrap border-b border-paper-line px-2 py-2 font-semibold text-ink">
                  Unit {i + 1}
                  {errorAt(errors, `units.${i}.unitNumber`) ? <p className="text-caption font-medium text-signal-error">{errorAt(errors, `units.${i}.unitNumber`)}</p> : null}
                </th>
                <td className="border-b border-paper-line px-2 py-2">
                  <CellInput
                    id={id(i, 'mass')}
                    label={`Unit ${i + 1}, moving mass [kg]`}
                    inputMode="decimal"
                    error={errorAt(errors, `units.${i}.movingMassKg`)}
                    {...register(`units.${i}.movingMassKg`, { setValueAs: numberOrUndefined })}
                  />
                </td>
                <td className="border-b border-paper-line px-2 py-2">
                  <CellInput
                    id={id(i, 'spring')}
                    label={`Unit ${i + 1}, spring rate [N/m]`}
                    inputMode="decimal"
                    error={errorAt(errors, `units.${i}.springRateNPerM`)}
                    {...register(`units.${i}.springRateNPerM`, { setValueAs: numberOrUndefined })}
                  />
                </td>
                <td className="border-b border-paper-line px-2 py-2">
                  <CellInput
                    id={id(i, 'frequency')}
                    label={`Unit ${i + 1}, tuned frequency [Hz]`}
                    inputMode="decimal"
                    error={errorAt(errors, `units.${i}.frequencyHz`)}
                    {...register(`units.${i}.frequencyHz`, { setValueAs: numberOrUndefined })}
                  />
                </td>
                <td className="border-b border-paper-line px-2 py-2">
                  <CellInput id={id(i, 'date')} label={`Unit ${i + 1}, measured on`} type="date" error={errorAt(errors, `units.${i}.measuredAt`)} {...register(`units.${i}.measuredAt`)} />
                </td>
                <td className="border-b border-paper-line px-2 py-2">
                  <CellInput id={id(i, 'note')} label={`Unit ${i + 1}, note`} autoComplete="off" error={errorAt(errors, `units.${i}.note`)} {...register(`units.${i}.note`)} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="flex flex-col gap-1">
        <label htmlFor={`as-built-${signOffId.slice(0, 8)}-note`} className="text-small font-semibold text-ink-soft">
          Note on this record <span className="font-normal text-ink-muted">(optional)</span>
        </label>
        <textarea
          id={`as-built-${signOffId.slice(0, 8)}-note`}
          rows={2}
          aria-invalid={errorAt(errors, 'note') ? true : undefined}
          className="block w-full rounded-plate border border-paper-line bg-paper-raised px-3 py-2 text-body text-ink aria-[invalid=true]:border-signal-error"
          placeholder="For example: after shimming the springs of unit 2"
          {...register('note')}
        />
        {errorAt(errors, 'note') ? <p className="text-caption font-medium text-signal-error">Note {errorAt(errors, 'note')}</p> : null}
      </div>
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" busy={record.isPending}>
          Add as-built record
        </Button>
        {saved ? (
          <p role="status" className="text-small text-signal-ok">
            <span aria-hidden="true">✓ </span>Stored. Its comparison is shown below; earlier records are kept.
          </p>
        ) : (
          <p className="text-caption text-ink-muted">Each save adds a record; earlier records are kept.</p>
        )}
      </div>
    </form>
  );
}
