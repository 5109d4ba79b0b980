import { useState } from 'react';
import { get, useForm, useWatch, type FieldErrors, type Path } from 'react-hook-form';
import { createComfortCriteriaSchema, type ComfortCriteria, type CreateComfortCriteriaInput } from '../../../../shared/contracts';
import { changesSomething, saveRefusalOf, type SaveRefusal } from '../../../components/forms/changes';
import { NumberField } from '../../../components/forms/number-field';
import { SaveRefusalNotice } from '../../../components/forms/save-refusal-notice';
import { Button } from '../../../components/ui/button';
import { SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { applyServerIssues } from '../../../lib/form-errors';
import { bodyResolver, dropBlank } from '../../../lib/form-resolver';
import { useCreateComfortCriteria, useUpdateComfortCriteria } from '../api/comfort-criteria';
import { criteriaChanges, criteriaToForm } from './criteria-changes';
import { criteriaClasses, criteriaSetLabels, describeCriteria, type CriteriaSet, type CriteriaSpec } from './criteria-info';
import { LimitLines } from './limit-lines';

export interface CriteriaFormValues {
  name: string;
  spec: { set: CriteriaSet; class?: string; peakAccelerationLimitMPerS2?: number; responseFactor?: number };
}

const sets: CriteriaSet[] = ['setra', 'hivoss', 'en1990', 'dg11', 'iso10137', 'custom'];
const firstClass = (set: CriteriaSet) => (set === 'custom' ? undefined : criteriaClasses[set][set === 'setra' ? 1 : 0].value);
const emptyForm: CriteriaFormValues = { name: '', spec: { set: 'setra', class: 'mean' } };

/** The body the server takes: a custom limit has no class, the others no custom number; blanks left out. */
export function criteriaBody(values: CriteriaFormValues): CreateComfortCriteriaInput {
  const spec = dropBlank({ ...values.spec });
  if (spec.set === 'custom') delete spec.class;
  else delete spec.peakAccelerationLimitMPerS2;
  if (spec.set !== 'iso10137') delete spec.responseFactor;
  return { name: values.name, spec: spec as CreateComfortCriteriaInput['spec'] };
}

const serverFields = ['name', 'spec.set', 'spec.class', 'spec.peakAccelerationLimitMPerS2', 'spec.responseFactor', 'spec'] as const satisfies readonly Path<CriteriaFormValues>[];
const errorAt = (errors: FieldErrors<CriteriaFormValues>, path: string): string | undefined =>
  (get(errors, path) as { message?: string } | undefined)?.message;
const resolver = bodyResolver<CriteriaFormValues, typeof createComfortCriteriaSchema>(createComfortCriteriaSchema, criteriaBody);

interface CriteriaFormProps {
  projectId: string;
  /** The stored criteria to change, the form opened on them; undefined to add new ones. */
  criteria?: ComfortCriteria;
  /** After the criteria were added or saved. */
  onDone: () => void;
  onCancel?: () => void;
  /** Fetches the stored criteria again (after a refused stale save) and opens the form on them. */
  onReload?: () => Promise<unknown>;
}

/** Adds comfort criteria, or changes the stored ones it is opened on (only what differs is sent, with the version read). */
export function CriteriaForm({ projectId, criteria, onDone, onCancel, onReload }: CriteriaFormProps) {
  const createCriteria = useCreateComfortCriteria(projectId);
  const updateCriteria = useUpdateComfortCriteria(projectId);
  const [formError, setFormError] = useState<string | null>(null);
  const [refusal, setRefusal] = useState<SaveRefusal | null>(null);
  // The criteria as the form was opened on them: their version is the one a save names, and changes are counted from it.
  const [opened] = useState(criteria);
  const { register, handleSubmit, setError, reset, getValues, control, formState } = useForm<CriteriaFormValues, unknown, unknown>({
    resolver: resolver as never,
    defaultValues: opened ? criteriaToForm(opened) : emptyForm,
  });
  const errors = formState.errors;
  const values = useWatch({ control }) as CriteriaFormValues;
  const set = values.spec.set;
  const preview = (() => {
    const body = criteriaBody(values);
    const spec = body.spec as CriteriaSpec;
    if (spec.set === 'custom' && !(typeof spec.peakAccelerationLimitMPerS2 === 'number' && spec.peakAccelerationLimitMPerS2 > 0)) return null;
    try {
      return describeCriteria(spec);
    } catch {
      return null;
    }
  })();
  // A page may hold a form to add criteria and one to change them at once: their field ids differ.
  const id = (name: string) => (opened ? `edit-${name}` : name);

  const onSubmit = handleSubmit((parsedBody) => {
    setFormError(null);
    setRefusal(null);
    const body = parsedBody as CreateComfortCriteriaInput;
    const onError = (error: unknown) => {
      const refused = saveRefusalOf(error);
      setRefusal(refused);
      if (!refused) setFormError(applyServerIssues(error, serverFields, setError));
    };
    if (opened) {
      const changes = criteriaChanges(opened, body);
      if (!changesSomething(changes)) {
        setFormError('Nothing differs from the stored criteria: change a value, or cancel.');
        return;
      }
      updateCriteria.mutate({ criteriaId: opened.id, input: changes }, { onSuccess: onDone, onError });
      return;
    }
    createCriteria.mutate(body, {
      onSuccess: () => {
        reset(emptyForm);
        onDone();
      },
      onError,
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label={opened ? `Edit comfort criteria ${opened.name}` : 'New comfort criteria'} className="flex flex-col gap-5">
      <SaveRefusalNotice refusal={refusal} what="criteria" onReload={onReload ?? (async () => undefined)} />
      {formError ? (
        <Notice tone="error" title={opened ? 'The comfort criteria were not saved' : 'The comfort criteria were not added'}>
          {formError}
        </Notice>
      ) : null}
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField id={id('criteria-name')} label="Name" autoComplete="off" error={errorAt(errors, 'name')} {...register('name')} />
        <SelectField
          id={id('criteria-set')}
          label="Criteria"
          value={set}
          error={errorAt(errors, 'spec.set')}
          onChange={(event) => {
            const next = event.target.value as CriteriaSet;
            reset({ ...getValues(), spec: { set: next, class: firstClass(next) } }, { keepDefaultValues: true });
          }}
        >
          {sets.map((entry) => (
            <option key={entry} value={entry}>
              {criteriaSetLabels[entry]}
            </option>
          ))}
        </SelectField>
        {set === 'custom' ? (
          <NumberField
            id={id('criteria-limit')}
            label="Peak acceleration limit [m/s²]"
            hint="One limit for the peak acceleration of every mode, as the project's specification sets it."
            name="spec.peakAccelerationLimitMPerS2"
            register={register}
            errors={errors}
          />
        ) : (
          <SelectField id={id('criteria-class')} label={set === 'en1990' ? 'Situation' : set === 'dg11' || set === 'iso10137' ? 'Use of the space' : 'Comfort class'} error={errorAt(errors, 'spec.class')} {...register('spec.class')}>
            {criteriaClasses[set].map((entry) => (
              <option key={entry.value} value={entry.value}>
                {entry.label}
              </option>
            ))}
          </SelectField>
        )}
        {set === 'iso10137' ? (
          <NumberField
            id={id('criteria-response-factor')}
            label="Response factor R [–]"
            optional
            hint="Left blank: the class's own factor."
            name="spec.responseFactor"
            register={register}
            errors={errors}
          />
        ) : null}
      </div>
      {preview ? (
        <section aria-label="The limits in plain words" className="rounded-plate border border-tide-200 bg-tide-50 px-4 py-3 text-small text-tide-900">
          <p className="mb-2 font-semibold">In plain words</p>
          <LimitLines lines={preview} />
        </section>
      ) : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={createCriteria.isPending || updateCriteria.isPending} disabled={refusal?.kind === 'frozen'}>
          {opened ? 'Save comfort criteria' : 'Add comfort criteria'}
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
