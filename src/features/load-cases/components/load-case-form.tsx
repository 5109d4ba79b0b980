import { useState } from 'react';
import { get, useForm, useWatch, type FieldErrors, type Path, type UseFormRegister } from 'react-hook-form';
import { createLoadCaseSchema, type CreateLoadCaseInput, type SavedLoadCase } from '../../../../shared/contracts';
import { dg11ConstantForceN } from '../../../../shared/engine/loads/floor-walking';
import { trafficClasses, type CrowdGuide } from '../../../../shared/engine/loads/pedestrian-crowd';
import { changesSomething, saveRefusalOf, type SaveRefusal } from '../../../components/forms/changes';
import { NumberField } from '../../../components/forms/number-field';
import { SaveRefusalNotice } from '../../../components/forms/save-refusal-notice';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { applyServerIssues } from '../../../lib/form-errors';
import { bodyResolver, dropBlank } from '../../../lib/form-resolver';
import { numberOrUndefined } from '../../../lib/form-values';
import { useCreateLoadCase, useUpdateLoadCase } from '../api/load-cases';
import { loadCaseChanges, loadCaseToForm } from './load-case-changes';
import { describeLoadCase, guideLabels, loadCaseKindLabels, loadCaseKinds, type LoadCaseKind, type LoadCaseSpec } from './load-case-info';
import { LoadCaseInfoBox } from './load-case-info-box';

type SpecValue = string | number | undefined | (number | undefined)[];
type FormSpec = { kind: LoadCaseKind } & { [field: string]: SpecValue };

export interface LoadCaseFormValues {
  name: string;
  /** Crowd and lateral: give the guide's traffic class or a density of your own. */
  densityBy: 'class' | 'density';
  spec: FormSpec;
}

const specDefaults: Record<LoadCaseKind, FormSpec> = {
  crowd: { kind: 'crowd', guide: 'setra', trafficClass: 'II', harmonic: 1 },
  lateral: { kind: 'lateral', guide: 'setra', trafficClass: 'II', harmonic: 1 },
  walker: { kind: 'walker' },
  jogger: { kind: 'jogger' },
  'moving-walker': { kind: 'moving-walker', gait: 'walking' },
  'floor-walking': { kind: 'floor-walking' },
  harmonic: { kind: 'harmonic' },
};

const emptyForm: LoadCaseFormValues = { name: '', densityBy: 'class', spec: specDefaults.crowd };

/** The body the server takes: blank fields left out, and only one of traffic class and density for a crowd. */
export function loadCaseBody(values: LoadCaseFormValues): CreateLoadCaseInput {
  const spec = dropBlank({ ...values.spec });
  if (spec.kind === 'crowd' || spec.kind === 'lateral') {
    if (values.densityBy === 'class') delete spec.densityPerM2;
    else delete spec.trafficClass;
  }
  return { name: values.name, spec: spec as unknown as CreateLoadCaseInput['spec'] };
}

/** The spec with placeholders for required numbers not yet given, to read the source and range while typing. */
function previewSpec(body: CreateLoadCaseInput): LoadCaseSpec {
  const spec = { ...body.spec } as Record<string, unknown>;
  if (spec.kind === 'crowd' || spec.kind === 'lateral') {
    spec.deckAreaM2 ??= 100;
    if (spec.trafficClass === undefined) spec.densityPerM2 ??= 0.5;
  }
  if (spec.kind === 'harmonic') {
    spec.modalForceAmplitudeN ??= 1;
    spec.pacingRangeHz ??= [1.6, 2.4];
  }
  if (spec.kind === 'moving-walker') spec.spanM ??= 30;
  return spec as unknown as LoadCaseSpec;
}

const number = { setValueAs: numberOrUndefined };
const errorAt = (errors: FieldErrors<LoadCaseFormValues>, path: string): string | undefined =>
  (get(errors, path) as { message?: string } | undefined)?.message;

const serverFields = [
  'name',
  'spec.kind',
  'spec.guide',
  'spec.trafficClass',
  'spec.densityPerM2',
  'spec.deckAreaM2',
  'spec.modeShapeMean',
  'spec.harmonic',
  'spec.lockInCoefficientNsPerM',
  'spec.pacingRangeHz',
  'spec.bodyWeightN',
  'spec.modeShapeValue',
  'spec.spanM',
  'spec.gait',
  'spec.pacingFrequencyHz',
  'spec.walkingSpeedMPerS',
  'spec.constantForceN',
  'spec.stepFrequencyRangeHz',
  'spec.harmonicCount',
  'spec.effectiveWeightN',
  'spec.modalForceAmplitudeN',
  'spec',
] as const satisfies readonly Path<LoadCaseFormValues>[];

const resolver = bodyResolver<LoadCaseFormValues, typeof createLoadCaseSchema>(createLoadCaseSchema, loadCaseBody);

interface LoadCaseFormProps {
  projectId: string;
  /** The stored load case to change, the form opened on it; undefined to add a new one. */
  loadCase?: SavedLoadCase;
  /** After the load case was added or saved. */
  onDone: () => void;
  onCancel?: () => void;
  /** Fetches the stored load case again (after a refused stale save) and opens the form on it. */
  onReload?: () => Promise<unknown>;
}

/** Adds a load case, or changes the stored one it is opened on (only what differs is sent, with the version read). */
export function LoadCaseForm({ projectId, loadCase, onDone, onCancel, onReload }: LoadCaseFormProps) {
  const createLoadCase = useCreateLoadCase(projectId);
  const updateLoadCase = useUpdateLoadCase(projectId);
  const [formError, setFormError] = useState<string | null>(null);
  const [refusal, setRefusal] = useState<SaveRefusal | null>(null);
  // The load case as the form was opened on it: its version is the one a save names, and changes are counted from it.
  const [opened] = useState(loadCase);
  const { register, handleSubmit, setError, reset, getValues, control, formState } = useForm<LoadCaseFormValues, unknown, unknown>({
    resolver: resolver as never,
    defaultValues: opened ? loadCaseToForm(opened) : emptyForm,
  });
  const errors = formState.errors;
  const values = useWatch({ control }) as LoadCaseFormValues;
  const spec = values.spec;
  const info = describeLoadCase(previewSpec(loadCaseBody(values)));
  // A page may hold a form to add a load case and one to change one at once: their field ids differ.
  const id = (name: string) => (opened ? `edit-${name}` : name);

  const onSubmit = handleSubmit((parsedBody) => {
    setFormError(null);
    setRefusal(null);
    const body = parsedBody as CreateLoadCaseInput;
    const onError = (error: unknown) => {
      const refused = saveRefusalOf(error);
      setRefusal(refused);
      if (!refused) setFormError(applyServerIssues(error, serverFields, setError));
    };
    if (opened) {
      const changes = loadCaseChanges(opened, body);
      if (!changesSomething(changes)) {
        setFormError('Nothing differs from the stored load case: change a value, or cancel.');
        return;
      }
      updateLoadCase.mutate({ loadCaseId: opened.id, input: changes }, { onSuccess: onDone, onError });
      return;
    }
    createLoadCase.mutate(body, {
      onSuccess: () => {
        reset(emptyForm);
        onDone();
      },
      onError,
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={opened ? `Edit load case ${opened.name}` : 'New load case'} className="flex flex-col gap-5">
      <SaveRefusalNotice refusal={refusal} what="load case" onReload={onReload ?? (async () => undefined)} />
      {formError ? (
        <Notice tone="error" title={opened ? 'The load case was not saved' : 'The load case was not added'}>
          {formError}
        </Notice>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField id={id('load-case-name')} label="Load case name" autoComplete="off" error={errorAt(errors, 'name')} {...register('name')} />
        <SelectField
          id={id('load-case-kind')}
          label="Kind"
          value={spec.kind}
          error={errorAt(errors, 'spec.kind')}
          onChange={(event) => {
            const kind = event.target.value as LoadCaseKind;
            reset({ ...getValues(), densityBy: 'class', spec: specDefaults[kind] }, { keepDefaultValues: true });
          }}
        >
          {loadCaseKinds.map((kind) => (
            <option key={kind} value={kind}>
              {loadCaseKindLabels[kind]}
            </option>
          ))}
        </SelectField>
        <KindFields kind={spec.kind} spec={spec} densityBy={values.densityBy} register={register} errors={errors} id={id} />
      </div>
      <LoadCaseInfoBox info={info} title="This load case follows" />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={createLoadCase.isPending || updateLoadCase.isPending} disabled={refusal?.kind === 'frozen'}>
          {opened ? 'Save load case' : 'Add load case'}
        </Button>
        {onCancel ? (
          <Button tone="quiet" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}

interface KindFieldsProps {
  kind: LoadCaseKind;
  spec: FormSpec;
  densityBy: LoadCaseFormValues['densityBy'];
  register: UseFormRegister<LoadCaseFormValues>;
  errors: FieldErrors<LoadCaseFormValues>;
  /** The id of a field of this form. */
  id: (name: string) => string;
}

function BandFields({ field, label, hint, register, errors }: { field: 'pacingRangeHz' | 'stepFrequencyRangeHz'; label: string; hint: string; register: UseFormRegister<LoadCaseFormValues>; errors: FieldErrors<LoadCaseFormValues> }) {
  const error = errorAt(errors, `spec.${field}`) ?? errorAt(errors, `spec.${field}.0`) ?? errorAt(errors, `spec.${field}.1`);
  return (
    <fieldset className="flex flex-col gap-1 sm:col-span-2">
      <legend className="text-small font-semibold text-ink-soft">{label}</legend>
      <div className="flex items-center gap-2">
        <input aria-label={`${label}: from [Hz]`} inputMode="decimal" placeholder="from" className="w-28 rounded-plate border border-paper-line bg-paper-raised px-3 py-2 tabular-nums" {...register(`spec.${field}.0`, number)} />
        <span className="text-ink-muted">to</span>
        <input aria-label={`${label}: to [Hz]`} inputMode="decimal" placeholder="to" className="w-28 rounded-plate border border-paper-line bg-paper-raised px-3 py-2 tabular-nums" {...register(`spec.${field}.1`, number)} />
        <span className="text-small text-ink-muted">Hz</span>
      </div>
      <p className="text-caption text-ink-muted">{hint}</p>
      {error ? <p className="text-caption font-medium text-signal-error">{`${label} ${error}`}</p> : null}
    </fieldset>
  );
}

function KindFields({ kind, spec, densityBy, register, errors, id }: KindFieldsProps) {
  switch (kind) {
    case 'crowd':
    case 'lateral': {
      const guide = (spec.guide as CrowdGuide | undefined) ?? 'setra';
      return (
        <>
          <SelectField id={id('load-case-guide')} label="Guide" error={errorAt(errors, 'spec.guide')} {...register('spec.guide')}>
            <option value="setra">{guideLabels.setra} (Sétra/AFGC footbridge guide)</option>
            <option value="hivoss">{guideLabels.hivoss} (HiVoSS footbridge guideline)</option>
          </SelectField>
          <fieldset className="flex flex-col gap-2">
            <legend className="text-small font-semibold text-ink-soft">Crowd given by</legend>
            <div className="flex gap-4 text-small">
              <label className="flex items-center gap-2">
                <input type="radio" value="class" {...register('densityBy')} /> The guide&apos;s traffic class
              </label>
              <label className="flex items-center gap-2">
                <input type="radio" value="density" {...register('densityBy')} /> A density
              </label>
            </div>
          </fieldset>
          {densityBy === 'class' ? (
            <SelectField id={id('load-case-traffic-class')} label="Traffic class" error={errorAt(errors, 'spec.trafficClass')} {...register('spec.trafficClass')}>
              {trafficClasses
                .filter((entry) => entry.guide === guide)
                .map((entry) => (
                  <option key={entry.name} value={entry.name}>
                    {entry.guide === 'setra' ? `Class ${entry.name}` : entry.name}: {entry.personCount !== undefined ? `${entry.personCount} persons on the deck` : `${entry.densityPerM2} persons/m²`} — {entry.description}
                  </option>
                ))}
            </SelectField>
          ) : (
            <NumberField id={id('load-case-density')} label="Density [persons/m²]" name="spec.densityPerM2" register={register} errors={errors} />
          )}
          <NumberField
            id={id('load-case-deck-area')}
            label="Deck area [m²]"
            hint="The loaded deck: number of pedestrians n = density × area."
            name="spec.deckAreaM2"
            register={register}
            errors={errors}
          />
          <NumberField
            id={id('load-case-shape-mean')}
            label="Mean |φ| over the deck [–]"
            optional
            hint="For the mode shape scaled to 1 at its largest; left blank: 2/π ≈ 0.637, a half sine."
            name="spec.modeShapeMean"
            register={register}
            errors={errors}
          />
          <SelectField id={id('load-case-harmonic')} label="Pedestrian force harmonic" error={errorAt(errors, 'spec.harmonic')} {...register('spec.harmonic', { setValueAs: (value) => Number(value) })}>
            <option value={1}>First harmonic (the pacing frequency)</option>
            <option value={2}>Second harmonic (twice the pacing frequency)</option>
          </SelectField>
          {kind === 'lateral' ? (
            <NumberField
              id={id('load-case-lock-in')}
              label="Lock-in coefficient k [N·s/m per person]"
              optional
              hint="Left blank: 300 N·s/m per person on 0.5–1.0 Hz (Dallard et al. 2001)."
              name="spec.lockInCoefficientNsPerM"
              register={register}
              errors={errors}
            />
          ) : null}
        </>
      );
    }
    case 'walker':
    case 'jogger':
      return (
        <>
          <NumberField id={id('load-case-body-weight')} label="Body weight G [N]" optional hint="Left blank: 800 N (from memory)." name="spec.bodyWeightN" register={register} errors={errors} />
          <NumberField
            id={id('load-case-shape-value')}
            label="|φ| where the person goes [–]"
            optional
            hint="Left blank: 1, the antinode."
            name="spec.modeShapeValue"
            register={register}
            errors={errors}
          />
          <BandFields field="pacingRangeHz" label="Pacing band" hint={`Left blank: ${kind === 'walker' ? '1.6–2.4' : '2.0–3.5'} Hz (from memory).`} register={register} errors={errors} />
        </>
      );
    case 'moving-walker':
      return (
        <>
          <NumberField id={id('load-case-span')} label="Span [m]" name="spec.spanM" register={register} errors={errors} />
          <SelectField id={id('load-case-gait')} label="Gait" error={errorAt(errors, 'spec.gait')} {...register('spec.gait')}>
            <option value="walking">Walking</option>
            <option value="jogging">Jogging</option>
          </SelectField>
          <NumberField
            id={id('load-case-pacing')}
            label="Pacing frequency [Hz]"
            optional
            hint="Left blank: the pace that puts a harmonic on the mode."
            name="spec.pacingFrequencyHz"
            register={register}
            errors={errors}
          />
          <NumberField
            id={id('load-case-speed')}
            label="Walking speed [m/s]"
            optional
            hint="Left blank: stride × pace (stride 0.75 m walking, 1.25 m jogging)."
            name="spec.walkingSpeedMPerS"
            register={register}
            errors={errors}
          />
          <NumberField id={id('load-case-walker-weight')} label="Body weight G [N]" optional hint="Left blank: 800 N (from memory)." name="spec.bodyWeightN" register={register} errors={errors} />
        </>
      );
    case 'floor-walking':
      return (
        <>
          <NumberField
            id={id('load-case-p0')}
            label="Constant force P0 [N]"
            optional
            hint={`Left blank: ${dg11ConstantForceN.floor} N for floors; DG11 gives ${dg11ConstantForceN.footbridge} N for footbridges.`}
            name="spec.constantForceN"
            register={register}
            errors={errors}
          />
          <NumberField
            id={id('load-case-weight')}
            label="Effective weight W [N]"
            optional
            hint="Left blank: 2 g × the modal mass, the weight of a bay whose half-sine modal mass is half its mass."
            name="spec.effectiveWeightN"
            register={register}
            errors={errors}
          />
          <NumberField id={id('load-case-harmonics')} label="Walking harmonics" optional hint="Left blank: 4 (from memory)." name="spec.harmonicCount" register={register} errors={errors} whole />
          <BandFields field="stepFrequencyRangeHz" label="Step frequency band" hint="Left blank: 1.6–2.2 Hz (from memory)." register={register} errors={errors} />
        </>
      );
    case 'harmonic':
      return (
        <>
          <NumberField id={id('load-case-force')} label="Modal force amplitude [N]" name="spec.modalForceAmplitudeN" register={register} errors={errors} />
          <BandFields field="pacingRangeHz" label="Force frequency band" hint="The force is swept over this band." register={register} errors={errors} />
        </>
      );
  }
}
