import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import { get, useForm, useWatch, type FieldErrors, type Path, type UseFormRegister } from 'react-hook-form';
import { createModeSchema, type LumpedModel, type ModeSourceInput, type SavedMode } from '../../../../shared/contracts';
import { beamSupports, deriveBeamMode, MAX_BEAM_MODE_NUMBER } from '../../../../shared/engine/beam';
import { changesSomething, saveRefusalOf, type SaveRefusal } from '../../../components/forms/changes';
import { NumberField } from '../../../components/forms/number-field';
import { SaveRefusalNotice } from '../../../components/forms/save-refusal-notice';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { applyServerIssues } from '../../../lib/form-errors';
import { formatNumber, formatPercent, formatQuantity } from '../../../lib/format';
import { useCreateMode, useUpdateMode } from '../api/structures';
import { describeEngineError } from './lumped-model-analysis';
import { modalMassAtDofKg } from './lumped-model-math';
import { beamSupportLabels, directionLabels } from './labels';
import { modeChanges, modeToForm, type ModeFormValues } from './mode-changes';

type BeamSourceInput = Extract<ModeSourceInput, { kind: 'beam' }>;
type ModelSourceInput = Extract<ModeSourceInput, { kind: 'lumped-model' }>;

/** Every path a server issue about a mode may name, in form order. */
const modeFormFields = [
  'label',
  'direction',
  'frequencyHz',
  'modalMassKg',
  'dampingRatio',
  'modeShapeMean',
  'source.support',
  'source.lengthM',
  'source.bendingStiffnessNM2',
  'source.massPerLengthKgPerM',
  'source.modeNumber',
  'source.modelId',
  'source.dofIndex',
  'source',
] as const satisfies readonly Path<ModeFormValues>[];

const errorAt = (errors: FieldErrors<ModeFormValues>, path: string): string | undefined =>
  (get(errors, path) as { message?: string } | undefined)?.message;

/**
 * What a mode form is for: adding a new mode (`mode` undefined; `onDone` after each one added), or changing the stored
 * `mode` it opens prefilled (`onDone` once saved, `onCancel` to close it, `onReload` to fetch the stored mode again).
 */
export interface ModeFormTarget {
  projectId: string;
  structureId: string;
  mode?: SavedMode;
  onDone: () => void;
  onCancel?: () => void;
  onReload?: () => Promise<unknown>;
}

/** One form to add or change a mode, whatever its source: the shared fields, the source's own, and the submit. */
function useModeForm({ projectId, structureId, mode, onDone }: ModeFormTarget, newValues: ModeFormValues) {
  const createMode = useCreateMode(projectId, structureId);
  const updateMode = useUpdateMode(projectId, structureId);
  const [formError, setFormError] = useState<string | null>(null);
  const [refusal, setRefusal] = useState<SaveRefusal | null>(null);
  // The mode as the form was opened on it: its version is the one a save names, and changes are counted from it.
  const [opened] = useState(mode);
  const form = useForm({ resolver: zodResolver(createModeSchema), defaultValues: opened ? modeToForm(opened) : newValues });
  const onError = (error: unknown) => {
    const refused = saveRefusalOf(error);
    setRefusal(refused);
    if (!refused) setFormError(applyServerIssues(error, modeFormFields, form.setError));
  };
  const onSubmit = form.handleSubmit((values) => {
    setFormError(null);
    setRefusal(null);
    if (opened) {
      const changes = modeChanges(opened, values);
      if (!changesSomething(changes)) {
        setFormError('Nothing differs from the stored mode: change a value, or cancel.');
        return;
      }
      updateMode.mutate({ modeId: opened.id, input: changes }, { onSuccess: onDone, onError });
      return;
    }
    createMode.mutate(values, {
      onSuccess: () => {
        // The entries stay for the next mode (another mode number of the same beam, say); only the label is cleared.
        form.setValue('label', '');
        onDone();
      },
      onError,
    });
  });
  // The page may hold a form to add a mode and one to change a mode at once: their field ids differ.
  const fieldId = (name: string) => (opened ? `edit-${name}` : name);
  return { form, onSubmit, formError, refusal, busy: createMode.isPending || updateMode.isPending, fieldId };
}

function CommonModeFields({ register, errors, idPrefix }: { register: UseFormRegister<ModeFormValues>; errors: FieldErrors<ModeFormValues>; idPrefix: string }) {
  return (
    <>
      <TextField id={`${idPrefix}-label`} label="Mode label" autoComplete="off" error={errorAt(errors, 'label')} {...register('label')} />
      <SelectField id={`${idPrefix}-direction`} label="Direction" error={errorAt(errors, 'direction')} {...register('direction')}>
        {Object.entries(directionLabels).map(([value, label]) => (
          <option key={value} value={value}>
            {label}
          </option>
        ))}
      </SelectField>
      <NumberField
        id={`${idPrefix}-damping`}
        label="Damping ratio ζ [–]"
        hint="A fraction of critical damping: 0.006 is 0.6 %, the composite footbridge value of the ISO 10137 / BS 5400 tables; steel about 0.005 and concrete 0.008 (from memory)."
        name="dampingRatio"
        register={register}
        errors={errors}
      />
    </>
  );
}

interface FormFrameProps {
  target: ModeFormTarget;
  /** The form's name when it adds a mode; a change is named after the mode. */
  label: string;
  formError: string | null;
  refusal: SaveRefusal | null;
  busy: boolean;
  submitLabel: string;
  onSubmit: () => void;
  children: ReactNode;
}

function FormFrame({ target, label, formError, refusal, busy, submitLabel, onSubmit, children }: FormFrameProps) {
  const editing = target.mode !== undefined;
  return (
    <form
      noValidate
      aria-label={target.mode ? `Edit mode ${target.mode.label}` : label}
      className="flex flex-col gap-5"
      onSubmit={(event) => {
        event.preventDefault();
        onSubmit();
      }}
    >
      <SaveRefusalNotice refusal={refusal} what="mode" onReload={target.onReload ?? (async () => undefined)} />
      {formError ? (
        <Notice tone="error" title={editing ? 'The mode was not saved' : 'The mode was not added'}>
          {formError}
        </Notice>
      ) : null}
      {children}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={busy} disabled={refusal?.kind === 'frozen'}>
          {editing ? 'Save mode' : submitLabel}
        </Button>
        {target.onCancel ? (
          <Button tone="quiet" onClick={target.onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}

const typedDefaults: ModeFormValues = { label: '', direction: 'vertical', dampingRatio: undefined as unknown as number, source: { kind: 'typed' } };

/** A mode typed in from a finite-element model or a measurement: frequency, modal mass, damping, direction. */
export function TypedModeForm(target: ModeFormTarget) {
  const { form, onSubmit, formError, refusal, busy, fieldId } = useModeForm(target, typedDefaults);
  const { register, formState } = form;
  const errors = formState.errors;
  return (
    <FormFrame target={target} label="Type a mode" formError={formError} refusal={refusal} busy={busy} submitLabel="Add mode" onSubmit={() => void onSubmit()}>
      <div className="grid gap-4 sm:grid-cols-2">
        <CommonModeFields register={register} errors={errors} idPrefix={fieldId('typed-mode')} />
        <NumberField id={fieldId('typed-mode-frequency')} label="Natural frequency [Hz]" name="frequencyHz" register={register} errors={errors} />
        <NumberField
          id={fieldId('typed-mode-modal-mass')}
          label="Modal mass [kg]"
          hint="For the mode shape scaled to 1 where the damper will sit."
          name="modalMassKg"
          register={register}
          errors={errors}
        />
        <NumberField
          id={fieldId('typed-mode-shape-mean')}
          label="Mean |φ| over the deck [–]"
          optional
          hint="Used by crowd load cases; 2/π ≈ 0.637 for a half sine."
          name="modeShapeMean"
          register={register}
          errors={errors}
        />
      </div>
    </FormFrame>
  );
}

const beamDefaults: ModeFormValues = {
  label: '',
  direction: 'vertical',
  dampingRatio: undefined as unknown as number,
  source: {
    kind: 'beam',
    support: 'simply-supported',
    lengthM: undefined as unknown as number,
    bendingStiffnessNM2: undefined as unknown as number,
    massPerLengthKgPerM: undefined as unknown as number,
    modeNumber: 1,
  },
};

/** A mode of a uniform beam: the engine derives frequency, modal mass and mean |φ| as the engineer types. */
export function BeamModeForm(target: ModeFormTarget) {
  const { form, onSubmit, formError, refusal, busy, fieldId } = useModeForm(target, beamDefaults);
  const { register, control, formState } = form;
  const errors = formState.errors;
  const source = useWatch({ control, name: 'source' }) as BeamSourceInput;
  const derived = (() => {
    const { support, lengthM, bendingStiffnessNM2, massPerLengthKgPerM, modeNumber } = source;
    if ([lengthM, bendingStiffnessNM2, massPerLengthKgPerM].some((value) => value === undefined)) return null;
    try {
      return { ok: true as const, mode: deriveBeamMode({ support, lengthM, bendingStiffnessNM2, massPerLengthKgPerM, modeNumber: modeNumber ?? 1 }) };
    } catch (error) {
      return { ok: false as const, problem: describeEngineError(error) };
    }
  })();

  return (
    <FormFrame target={target} label="Derive a mode from a beam" formError={formError} refusal={refusal} busy={busy} submitLabel="Add beam mode" onSubmit={() => void onSubmit()}>
      <div className="grid gap-4 sm:grid-cols-2">
        <CommonModeFields register={register} errors={errors} idPrefix={fieldId('beam-mode')} />
        <SelectField id={fieldId('beam-support')} label="Supports" error={errorAt(errors, 'source.support')} {...register('source.support')}>
          {beamSupports.map((support) => (
            <option key={support} value={support}>
              {beamSupportLabels[support]}
            </option>
          ))}
        </SelectField>
        <NumberField id={fieldId('beam-length')} label="Length L [m]" name="source.lengthM" register={register} errors={errors} />
        <NumberField
          id={fieldId('beam-stiffness')}
          label="Bending stiffness EI [N·m²]"
          hint="E × I of the whole cross-section, e.g. 2.1e9."
          name="source.bendingStiffnessNM2"
          register={register}
          errors={errors}
        />
        <NumberField
          id={fieldId('beam-mass')}
          label="Mass per length m [kg/m]"
          hint="Structure and permanent finishes."
          name="source.massPerLengthKgPerM"
          register={register}
          errors={errors}
        />
        <NumberField
          id={fieldId('beam-mode-number')}
          label="Mode number"
          hint={`1 for the fundamental, up to ${MAX_BEAM_MODE_NUMBER}.`}
          name="source.modeNumber"
          register={register}
          errors={errors}
          whole
        />
      </div>
      <section aria-label="Derived from the beam" aria-live="polite" className="rounded-plate border border-tide-200 bg-tide-50 px-4 py-3 text-small text-tide-900">
        <p className="font-semibold">Derived from the beam</p>
        {derived === null ? (
          <p className="mt-1">Give the length, EI and mass per length to see the mode.</p>
        ) : derived.ok ? (
          <dl className="mt-2 grid gap-x-6 gap-y-1 sm:grid-cols-2">
            <div>
              <dt className="inline">Natural frequency: </dt>
              <dd className="inline font-semibold tabular-nums">{formatQuantity(derived.mode.frequencyHz, 'Hz')}</dd>
            </div>
            <div>
              <dt className="inline">Modal mass: </dt>
              <dd className="inline font-semibold tabular-nums">
                {formatQuantity(derived.mode.modalMassKg, 'kg')} ({formatNumber(derived.mode.modalMassFraction, 3)} m L)
              </dd>
            </div>
            <div>
              <dt className="inline">Mean |φ| over the length: </dt>
              <dd className="inline font-semibold tabular-nums">{formatNumber(derived.mode.modeShapeMean, 3)}</dd>
            </div>
            <div>
              <dt className="inline">λ: </dt>
              <dd className="inline font-semibold tabular-nums">{formatNumber(derived.mode.eigenvalueParameter, 5)}</dd>
            </div>
          </dl>
        ) : (
          <p className="mt-1 text-signal-error">{derived.problem}</p>
        )}
        <p className="mt-2 text-caption text-ink-soft">
          f = λ² / (2π L²) · √(EI / m), modal mass for the shape scaled to 1 at its largest value (mL/2 simply supported). The
          server derives the stored numbers with the same engine.
        </p>
      </section>
    </FormFrame>
  );
}

/** "Use this mode at this DOF": a design mode taken from a saved lumped model, its numbers derived by the server. */
export function ModelModeForm({ model, ...target }: ModeFormTarget & { model: LumpedModel }) {
  const defaults: ModeFormValues = {
    label: '',
    direction: 'vertical',
    dampingRatio: undefined as unknown as number,
    source: { kind: 'lumped-model', modelId: model.id, modeNumber: 1, dofIndex: model.massMatrixKg.length - 1 },
  };
  const { form, onSubmit, formError, refusal, busy, fieldId } = useModeForm(target, defaults);
  const { register, control, formState } = form;
  const errors = formState.errors;
  const source = useWatch({ control, name: 'source' }) as ModelSourceInput;
  const dofLabel = (index: number) => model.dofLabels?.[index] ?? `DOF ${index + 1}`;
  const chosen = model.modes[source.modeNumber - 1];
  const shapeValue = chosen?.shape[source.dofIndex];
  const atNode = chosen !== undefined && shapeValue !== undefined && Math.abs(shapeValue) < 1e-9 * Math.max(...chosen.shape.map(Math.abs));

  return (
    <FormFrame target={target} label="Use a mode of this model" formError={formError} refusal={refusal} busy={busy} submitLabel="Add as a design mode" onSubmit={() => void onSubmit()}>
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField id={fieldId('model-mode-number')} label="Mode of the model" error={errorAt(errors, 'source.modeNumber')} {...register('source.modeNumber', { valueAsNumber: true })}>
          {model.modes.map((mode, index) => (
            <option key={index} value={index + 1}>
              Mode {index + 1}: {formatQuantity(mode.frequencyHz, 'Hz')}
            </option>
          ))}
        </SelectField>
        <SelectField
          id={fieldId('model-mode-dof')}
          label="Damper at"
          hint="The degree of freedom where the damper would sit; the modal mass is for the shape scaled to 1 there."
          error={errorAt(errors, 'source.dofIndex')}
          {...register('source.dofIndex', { valueAsNumber: true })}
        >
          {model.massMatrixKg.map((_, index) => (
            <option key={index} value={index}>
              {dofLabel(index)}
            </option>
          ))}
        </SelectField>
        <CommonModeFields register={register} errors={errors} idPrefix={fieldId('model-mode')} />
      </div>
      {chosen && shapeValue !== undefined ? (
        atNode ? (
          <Notice tone="caution" title="This degree of freedom is a node of the mode">
            The mode does not move there, so a damper at {dofLabel(source.dofIndex)} would not act on it.
          </Notice>
        ) : (
          <p className="text-small text-ink-soft" aria-live="polite">
            Design mode: {formatQuantity(chosen.frequencyHz, 'Hz')}, modal mass {formatQuantity(modalMassAtDofKg(chosen.shape, source.dofIndex), 'kg')} (1/φ² of
            the mass-normalised shape at that degree of freedom).
          </p>
        )
      ) : null}
    </FormFrame>
  );
}

/** The damping ratio in words with its percentage, for tables. */
export function formatDampingRatio(ratio: number): string {
  return `${formatNumber(ratio, 3)} (${formatPercent(ratio)})`;
}
