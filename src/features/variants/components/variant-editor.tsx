import { useEffect, useMemo, useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import {
  createVariantSchema,
  type ComfortCriteria,
  type SavedLoadCase,
  type Variant,
} from '../../../../shared/contracts';
import type { VariantComputeInput } from '../../../../shared/compute/variant';
import { tuningMethods } from '../../../../shared/engine/types';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { isApiError } from '../../../lib/api-client';
import { useDisplayUnits } from '../../../lib/display-units';
import { formatNumber, formatPercent } from '../../../lib/format';
import { numberOrUndefined } from '../../../lib/form-values';
import { fromDisplay, toDisplay } from '../../../lib/units';
import { useCreateVariant, useUpdateVariant, type ModeChoice } from '../api/variants';
import { useLiveVariant } from '../hooks/use-live-variant';
import { CurvesPanels } from './curves-panels';
import { tuningMethodLabels } from './labels';
import { strokeOf } from './result-panels';
import {
  emptyVariantForm,
  placeIssues,
  toVariantInput,
  toVariantUpdate,
  variantResolver,
  variantToForm,
  type VariantFormValues,
} from './variant-form-model';
import { UtilisationBar, VerdictTag } from './verdict-tag';

interface VariantEditorProps {
  projectId: string;
  variant?: Variant;
  modes: readonly ModeChoice[];
  loadCases: readonly SavedLoadCase[];
  comfortCriteria: readonly ComfortCriteria[];
  onSaved: (variant: Variant) => void;
  onCancel: () => void;
}

const MASS_RATIO_SLIDER_MAX_PERCENT = 10;

/**
 * The tuning variant's form beside its live check: every change of the mode, load cases, criteria, mass ratio or
 * tuning recomputes the result and the curves in a worker, with the code the server runs on save.
 */
export function VariantEditor({ projectId, variant, modes, loadCases, comfortCriteria, onSaved, onCancel }: VariantEditorProps) {
  const units = useDisplayUnits();
  const createVariant = useCreateVariant(projectId);
  const updateVariant = useUpdateVariant(projectId, variant?.id ?? '');
  const [formError, setFormError] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const [plotIndex, setPlotIndex] = useState(0);

  const defaults = useMemo(
    () =>
      variant
        ? variantToForm(variant, units.system)
        : emptyVariantForm({
            modeId: (modes.find((choice) => choice.mode.direction === 'vertical') ?? modes[0])?.mode.id,
            loadCaseIds: loadCases.slice(0, 1).map((lc) => lc.id),
            criteriaId: comfortCriteria[0]?.id,
          }),
    // Defaults are read once, when the form opens.
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [],
  );
  const {
    register,
    handleSubmit,
    setError,
    setValue,
    getValues,
    control,
    formState: { errors },
  } = useForm<VariantFormValues>({ resolver: variantResolver(units.system), defaultValues: defaults, mode: 'onChange' });
  const values = useWatch({ control }) as VariantFormValues;

  // A change of display units while the form is open converts the one field typed in a unit (the hardware travel).
  const shownSystem = useRef(units.system);
  useEffect(() => {
    const previous = shownSystem.current;
    if (previous === units.system) return;
    shownSystem.current = units.system;
    const typed = numberOrUndefined(getValues('strokeLimit'));
    if (typed !== undefined && Number.isFinite(typed)) {
      const metres = fromDisplay('displacement', typed, previous);
      setValue('strokeLimit', Number(toDisplay('displacement', metres, units.system).toPrecision(6)), { shouldValidate: true });
    }
  }, [units.system, getValues, setValue]);

  const selectedMode = modes.find((choice) => choice.mode.id === values.modeId);
  const selectedLoadCases = (values.loadCaseIds ?? []).map((id) => loadCases.find((lc) => lc.id === id)).filter((lc): lc is SavedLoadCase => Boolean(lc));
  const selectedCriteria = comfortCriteria.find((c) => c.id === values.criteriaId);

  // The live computation's input, when the form's values pass the contract schema.
  const liveInput = useMemo<VariantComputeInput | null>(() => {
    if (!selectedMode || !selectedCriteria || selectedLoadCases.length === 0) return null;
    const parsed = createVariantSchema.safeParse(toVariantInput(values, units.system));
    if (!parsed.success) return null;
    const v = parsed.data;
    return {
      mode: {
        modalMassKg: selectedMode.mode.modalMassKg,
        frequencyHz: selectedMode.mode.frequencyHz,
        dampingRatio: selectedMode.mode.dampingRatio,
        direction: selectedMode.mode.direction,
        modeShapeMean: selectedMode.mode.modeShapeMean,
      },
      loadCases: selectedLoadCases.map((lc) => ({ id: lc.id, name: lc.name, spec: lc.spec })),
      criteria: { spec: selectedCriteria.spec },
      variant: {
        massRatio: v.massRatio,
        tuning: v.tuning,
        unitCount: v.unitCount,
        structureFrequencyToleranceRatio: v.structureFrequencyToleranceRatio,
        tmdDampingToleranceRatio: v.tmdDampingToleranceRatio ?? null,
        hardware: v.hardware,
      },
    };
  }, [values, units.system, selectedMode, selectedCriteria, selectedLoadCases]);

  const index = Math.min(plotIndex, Math.max(selectedLoadCases.length - 1, 0));
  const live = useLiveVariant(liveInput, index);
  const liveIssues = live.error ? placeIssues(live.error.issues) : null;

  const onSubmit = handleSubmit((formValues) => {
    setFormError(null);
    setStale(false);
    const onError = (error: unknown) => {
      if (isApiError(error) && error.isConflict) {
        setStale(true);
        return;
      }
      if (isApiError(error) && error.issues.length) {
        const { fields, rest } = placeIssues(error.issues);
        let first = true;
        for (const [field, message] of Object.entries(fields)) {
          setError(field as keyof VariantFormValues, { type: 'server', message }, { shouldFocus: first });
          first = false;
        }
        setFormError(rest.length ? rest.join(' ') : null);
        return;
      }
      setFormError(isApiError(error) ? error.message : 'The variant could not be saved.');
    };
    if (variant) updateVariant.mutate(toVariantUpdate(formValues, units.system, variant.version), { onSuccess: onSaved, onError });
    else createVariant.mutate(toVariantInput(formValues, units.system), { onSuccess: onSaved, onError });
  });

  const massRatioPercent = Number(values.massRatioPercent);
  const answer = live.answer;
  const result = answer?.result;
  const governingCase = result?.loadCases.find((lc) => lc.loadCaseId === result.governing.loadCaseId);

  return (
    <form onSubmit={onSubmit} noValidate aria-label={variant ? `Edit ${variant.name}` : 'New tuning variant'} className="flex flex-col gap-6">
      {formError ? (
        <Notice tone="error" title="The variant was not saved">
          {formError}
        </Notice>
      ) : null}
      {stale ? (
        <Notice tone="caution" title="Someone else changed this variant">
          Your changes were not saved. Reload the variant to see the stored version, then make your changes again.
        </Notice>
      ) : null}

      <div className="grid items-start gap-6 xl:grid-cols-[22rem_minmax(0,1fr)]">
        <div className="flex flex-col gap-5">
          <Panel title="What it treats">
            <div className="flex flex-col gap-4">
              <TextField label="Name" error={errors.name?.message} {...register('name')} />
              <SelectField label="Mode" error={errors.modeId?.message} {...register('modeId')}>
                {modes.length === 0 ? <option value="">No modes in this project yet</option> : null}
                {modes.map(({ structure, mode }) => (
                  <option key={mode.id} value={mode.id}>
                    {structure.name} · {mode.label} · {formatNumber(mode.frequencyHz, 4)} Hz
                  </option>
                ))}
              </SelectField>
              {selectedMode ? (
                <p className="-mt-2 text-caption text-ink-muted">
                  {selectedMode.mode.direction}, modal mass {units.format('mass', selectedMode.mode.modalMassKg)}, damping {formatPercent(selectedMode.mode.dampingRatio, 3)}
                </p>
              ) : null}
              <fieldset className="flex flex-col gap-1.5" aria-describedby={errors.loadCaseIds ? 'variant-load-cases-error' : undefined}>
                <legend className="mb-1 text-small font-semibold text-ink-soft">Load cases</legend>
                {loadCases.map((lc) => (
                  <label key={lc.id} className="flex items-center gap-2 text-small text-ink">
                    <input type="checkbox" value={lc.id} className="size-4 accent-tide-700" {...register('loadCaseIds')} />
                    {lc.name}
                  </label>
                ))}
                {errors.loadCaseIds ? (
                  <p id="variant-load-cases-error" className="text-caption font-medium text-signal-error">
                    Load cases {errors.loadCaseIds.message}
                  </p>
                ) : null}
              </fieldset>
              <SelectField label="Comfort criteria" error={errors.criteriaId?.message} {...register('criteriaId')}>
                {comfortCriteria.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.name}
                  </option>
                ))}
              </SelectField>
            </div>
          </Panel>

          <Panel title="Damper">
            <div className="flex flex-col gap-4">
              <div className="flex flex-col gap-2">
                <TextField
                  label="Mass ratio [%]"
                  type="number"
                  step="any"
                  inputMode="decimal"
                  hint={selectedMode && Number.isFinite(massRatioPercent) ? `Total moving mass ${units.format('mass', (massRatioPercent / 100) * selectedMode.mode.modalMassKg)}` : 'Of the modal mass'}
                  error={errors.massRatioPercent?.message ?? liveIssues?.fields.massRatioPercent}
                  {...register('massRatioPercent')}
                />
                <input
                  type="range"
                  aria-label="Mass ratio slider [%]"
                  min={0.1}
                  max={MASS_RATIO_SLIDER_MAX_PERCENT}
                  step={0.05}
                  value={Number.isFinite(massRatioPercent) ? Math.min(Math.max(massRatioPercent, 0.1), MASS_RATIO_SLIDER_MAX_PERCENT) : 2}
                  onChange={(event) => setValue('massRatioPercent', Number(event.target.value), { shouldValidate: true, shouldDirty: true })}
                  className="w-full accent-tide-700"
                />
                <div className="flex justify-between text-caption text-ink-muted" aria-hidden="true">
                  <span>0.1 %</span>
                  <span>usual 0.5–10 %</span>
                  <span>{MASS_RATIO_SLIDER_MAX_PERCENT} %</span>
                </div>
              </div>
              <fieldset className="flex flex-col gap-1.5">
                <legend className="mb-1 text-small font-semibold text-ink-soft">Tuning</legend>
                <label className="flex items-center gap-2 text-small">
                  <input type="radio" value="method" className="accent-tide-700" {...register('tuningKind')} /> By a published method
                </label>
                <label className="flex items-center gap-2 text-small">
                  <input type="radio" value="manual" className="accent-tide-700" {...register('tuningKind')} /> Set by hand
                </label>
              </fieldset>
              {values.tuningKind === 'method' ? (
                <SelectField label="Method" error={errors.method?.message ?? liveIssues?.fields.method} {...register('method')}>
                  {tuningMethods.map((method) => (
                    <option key={method} value={method}>
                      {tuningMethodLabels[method]}
                    </option>
                  ))}
                </SelectField>
              ) : (
                <div className="grid grid-cols-2 gap-3">
                  <TextField label="Damper frequency [Hz]" type="number" step="any" error={errors.frequencyHz?.message} {...register('frequencyHz')} />
                  <TextField
                    label="Damping ratio [%]"
                    type="number"
                    step="any"
                    hint="of critical, referred to the damper's own frequency"
                    error={errors.dampingRatioPercent?.message}
                    {...register('dampingRatioPercent')}
                  />
                </div>
              )}
              {result ? (
                <p className="rounded-plate bg-paper px-3 py-2 text-caption text-ink-soft">
                  Tuned to {formatNumber(result.tmd.frequencyHz, 4)} Hz, damping {formatPercent(result.tmd.dampingRatio, 3)} (own frequency), moving mass{' '}
                  {units.format('mass', result.tmd.massKg)}
                </p>
              ) : null}
            </div>
          </Panel>

          <Panel title="Tolerances and hardware">
            <div className="grid grid-cols-2 gap-3">
              <TextField label="Units" type="number" step={1} error={errors.unitCount?.message} {...register('unitCount')} />
              <TextField label="Springs per unit" type="number" step={1} optional hint="default 4" error={errors.springsPerUnit?.message} {...register('springsPerUnit')} />
              <TextField
                label="Detuning band ± [%]"
                type="number"
                step="any"
                hint="of the structure's frequency"
                error={errors.structureFrequencyTolerancePercent?.message}
                {...register('structureFrequencyTolerancePercent')}
              />
              <TextField
                label="Damping tolerance ± [%]"
                type="number"
                step="any"
                optional
                error={errors.tmdDampingTolerancePercent?.message}
                {...register('tmdDampingTolerancePercent')}
              />
              <TextField label="Stroke margin ×" type="number" step="any" optional hint="default 1.5" error={errors.strokeMarginFactor?.message} {...register('strokeMarginFactor')} />
              <TextField
                label={`Hardware travel [${units.label('displacement')}]`}
                type="number"
                step="any"
                optional
                hint="zero to peak"
                error={errors.strokeLimit?.message}
                {...register('strokeLimit')}
              />
            </div>
            <div className="mt-4">
              <TextAreaField label="Notes" optional error={errors.notes?.message} {...register('notes')} />
            </div>
          </Panel>

          <div className="flex flex-wrap gap-3">
            <Button type="submit" busy={createVariant.isPending || updateVariant.isPending}>
              {variant ? 'Save variant' : 'Create variant'}
            </Button>
            <Button tone="quiet" onClick={onCancel}>
              Cancel
            </Button>
          </div>
        </div>

        <section aria-label="Live check" className="flex min-w-0 flex-col gap-5 rounded-plate border border-tide-200 bg-paper-raised p-5 sm:p-6">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 className="text-lead font-semibold text-ink">Live check</h2>
            <p className="text-caption text-ink-muted" aria-live="polite">
              {live.busy ? (
                <span className="inline-flex items-center gap-1.5">
                  <span aria-hidden="true" className="size-2.5 animate-spin rounded-full border-2 border-tide-600 border-r-transparent" />
                  computing…
                </span>
              ) : answer ? (
                <span data-testid="live-timing">computed in your browser in {formatNumber(answer.timing.totalMs, 3)} ms</span>
              ) : null}
            </p>
          </div>
          {live.error ? (
            <Notice tone="error" title="The engine refuses these inputs">
              {live.error.message}
            </Notice>
          ) : null}
          {!liveInput && !live.busy ? (
            <p className="text-small text-ink-muted">
              {result
                ? 'Showing the last inputs the engine could check: correct the fields marked in the form to update it.'
                : 'Choose a mode, at least one load case and the comfort criteria, and give a mass ratio, to see the check.'}
            </p>
          ) : null}
          {result ? (
            <>
              <dl className="grid gap-3 sm:grid-cols-2" aria-label="Governing figures">
                <div className="flex flex-col gap-1 rounded-plate bg-paper px-3 py-2">
                  <dt className="text-caption font-semibold uppercase tracking-[0.06em] text-ink-muted">Governing peak</dt>
                  <dd className="text-title font-semibold tabular-nums text-ink" data-testid="live-governing-peak">
                    {units.format('acceleration', result.governing.peakAccelerationMPerS2, 4)}
                  </dd>
                  <dd className="text-caption text-ink-muted">
                    bare {units.format('acceleration', governingCase?.bareStructurePeakAccelerationMPerS2, 3)} · {governingCase?.name}
                  </dd>
                </div>
                <div className="flex flex-col gap-1 rounded-plate bg-paper px-3 py-2">
                  <dt className="text-caption font-semibold uppercase tracking-[0.06em] text-ink-muted">Use of limit</dt>
                  <dd className="pt-1">
                    <UtilisationBar utilisation={result.governing.utilisation} />
                  </dd>
                  <dd>
                    <VerdictTag verdict={result.governing.verdict} size="small" />
                  </dd>
                </div>
                <div className="flex flex-col gap-1 rounded-plate bg-paper px-3 py-2">
                  <dt className="text-caption font-semibold uppercase tracking-[0.06em] text-ink-muted">Worst detuned</dt>
                  <dd className="text-lead font-semibold tabular-nums text-ink">{units.format('acceleration', result.detuning.worstPeakAccelerationMPerS2, 3)}</dd>
                  <dd className="text-caption text-ink-muted">
                    {Math.round(result.detuning.worstUtilisation * 100)} % of limit over ±{formatPercent(result.detuning.structureFrequencyToleranceRatio, 2)}
                  </dd>
                </div>
                <div className="flex flex-col gap-1 rounded-plate bg-paper px-3 py-2">
                  <dt className="text-caption font-semibold uppercase tracking-[0.06em] text-ink-muted">Largest stroke</dt>
                  <dd className="text-lead font-semibold tabular-nums text-ink">
                    {units.format('displacement', Math.max(0, ...result.loadCases.map(strokeOf)), 3)}
                  </dd>
                  <dd className="text-caption text-ink-muted">zero to peak, before margin</dd>
                </div>
              </dl>
              {selectedLoadCases.length > 1 ? (
                <div role="tablist" aria-label="Load case plotted" className="flex flex-wrap gap-1 border-b border-paper-line">
                  {selectedLoadCases.map((lc, i) => (
                    <button
                      key={lc.id}
                      type="button"
                      role="tab"
                      aria-selected={i === index}
                      onClick={() => setPlotIndex(i)}
                      className={`-mb-px border-b-2 px-3 py-1.5 text-small font-semibold ${
                        i === index ? 'border-tide-700 text-ink' : 'border-transparent text-ink-muted hover:text-ink'
                      }`}
                    >
                      {lc.name}
                    </button>
                  ))}
                </div>
              ) : null}
              {answer && selectedMode ? (
                <CurvesPanels
                  curves={answer.curves}
                  strokeLimitM={liveInput?.variant.hardware?.strokeLimitM ?? null}
                  structureFrequencyToleranceRatio={result.detuning.structureFrequencyToleranceRatio}
                  tmdDampingToleranceRatio={result.detuning.tmdDampingToleranceRatio}
                  structureFrequencyHz={selectedMode.mode.frequencyHz}
                />
              ) : null}
            </>
          ) : null}
          <Caution>These figures are computed as you type; the stored result is computed again on the server when you save.</Caution>
        </section>
      </div>
    </form>
  );
}
