import { useState } from 'react';
import { get, useForm, useWatch, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import type { LumpedModel } from '../../../../shared/contracts';
import { ModeShapeChart } from '../../../components/charts/lazy-charts';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { Unit } from '../../../components/ui/unit';
import { Panel } from '../../../components/ui/panel';
import { isApiError } from '../../../lib/api-client';
import { applyServerIssues } from '../../../lib/form-errors';
import { numberOrUndefined } from '../../../lib/form-values';
import { formatNumber } from '../../../lib/format';
import { useCreateLumpedModel, useReloadLumpedModels, useUpdateLumpedModel } from '../api/structures';
import { FreeVibrationPanel } from './free-vibration-panel';
import { analyseModel, dofName, type ModelAnalysis } from './lumped-model-analysis';
import {
  dofCountOf,
  emptyModelForm,
  MAX_EDITOR_DOF,
  modelBody,
  modelChanges,
  modelFormResolver,
  modelToForm,
  resizeModelForm,
  type ModelFormValues,
} from './lumped-model-form';
import { matricesToChain, scaleToUnitMax } from './lumped-model-math';
import { ModelModesTable } from './model-modes-table';

const serverFields = ['name', 'dofLabels', 'massesKg', 'springsNPerM', 'massMatrixKg', 'stiffnessMatrixNPerM'] as const;
const errorAt = (errors: FieldErrors<ModelFormValues>, path: string): string | undefined =>
  (get(errors, path) as { message?: string } | undefined)?.message;
const number = { setValueAs: numberOrUndefined };
const cellClass =
  'w-28 rounded-plate border border-paper-line bg-paper-raised px-2 py-1 text-right tabular-nums aria-[invalid=true]:border-signal-error aria-[invalid=true]:bg-signal-error-bg/40';
const headClass = 'px-2 pb-1 text-left text-caption font-semibold uppercase tracking-[0.08em] text-ink-muted';

interface LumpedModelEditorProps {
  projectId: string;
  structureId: string;
  /** The saved model being changed; undefined for a new one. */
  model?: LumpedModel;
  onSaved: (model: LumpedModel) => void;
  /** Called when a save starts (to clear an earlier "saved" message). */
  onSaving?: () => void;
  onCancel?: () => void;
}

/**
 * The n-DOF model editor: masses and springs as a chain or as full matrices, its undamped modes and a free vibration
 * computed in the browser by the engine as the engineer types; saved as matrices.
 */
export function LumpedModelEditor({ projectId, structureId, model, onSaved, onSaving, onCancel }: LumpedModelEditorProps) {
  const createModel = useCreateLumpedModel(projectId, structureId);
  const updateModel = useUpdateLumpedModel(projectId, structureId);
  const reloadModels = useReloadLumpedModels(projectId, structureId);
  const [formError, setFormError] = useState<string | null>(null);
  const [entryProblem, setEntryProblem] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const form = useForm<ModelFormValues, unknown, ModelFormValues>({
    resolver: modelFormResolver as never,
    defaultValues: model ? modelToForm(model) : emptyModelForm(2),
  });
  const { register, handleSubmit, setError, getValues, reset, control, formState } = form;
  const errors = formState.errors;
  const values = useWatch({ control }) as ModelFormValues;
  const n = dofCountOf(values);
  const analysis = analyseModel(values);

  const onSubmit = handleSubmit((formValues) => {
    setFormError(null);
    setStale(false);
    onSaving?.();
    const onError = (error: unknown) => {
      if (isApiError(error) && error.isConflict) setStale(true);
      else setFormError(applyServerIssues(error, serverFields, setError));
    };
    if (model) updateModel.mutate({ modelId: model.id, input: modelChanges(formValues, model.version) }, { onSuccess: onSaved, onError });
    else createModel.mutate(modelBody(formValues), { onSuccess: onSaved, onError });
  });

  const resize = (count: number) => reset(resizeModelForm(getValues(), count), { keepDefaultValues: true });
  const switchEntry = (entry: ModelFormValues['entry']) => {
    setEntryProblem(null);
    const current = getValues();
    if (entry === current.entry) return;
    if (entry === 'matrices') {
      const built = analysis.ok || analysis.matrices ? (analysis.ok ? analysis.matrices : analysis.matrices!) : null;
      reset({ ...current, entry, ...(built ?? {}) }, { keepDefaultValues: true });
      return;
    }
    const chain = matricesToChain(current.massMatrixKg as number[][], current.stiffnessMatrixNPerM as number[][]);
    if (!chain) {
      setEntryProblem('These matrices are not those of a chain (a diagonal mass matrix and springs only between neighbours and from the first mass to the ground), so they stay as matrices.');
      return;
    }
    reset({ ...current, entry, ...chain }, { keepDefaultValues: true });
  };

  return (
    <div className="flex flex-col gap-6">
      <form onSubmit={onSubmit} noValidate aria-label={model ? `Edit model ${model.name}` : 'New lumped model'} className="flex flex-col gap-5">
        {stale ? (
          <Notice
            tone="caution"
            title="Changed by someone else"
            action={
              <Button tone="secondary" onClick={() => void reloadModels()}>
                Reload model
              </Button>
            }
          >
            Someone changed this model after you opened it, so your changes were not saved. Reload to see the stored model
            (your edits here will be replaced), then make your change again.
          </Notice>
        ) : null}
        {formError ? (
          <Notice tone="error" title="The model was not saved">
            {formError}
          </Notice>
        ) : null}
        <div className="grid gap-4 sm:grid-cols-[minmax(0,1fr)_12rem]">
          <TextField id="model-name" label="Model name" autoComplete="off" error={errorAt(errors, 'name')} {...register('name')} />
          <label className="flex flex-col gap-1 text-small font-semibold text-ink-soft">
            Degrees of freedom
            <select
              className="rounded-plate border border-paper-line bg-paper-raised px-3 py-2 text-body font-normal text-ink"
              value={n}
              onChange={(event) => resize(Number(event.target.value))}
            >
              {Array.from({ length: MAX_EDITOR_DOF }, (_, i) => (
                <option key={i} value={i + 1}>
                  {i + 1}
                </option>
              ))}
            </select>
          </label>
        </div>
        <fieldset className="flex flex-col gap-2">
          <legend className="text-small font-semibold text-ink-soft">Enter the model as</legend>
          <div className="flex flex-wrap gap-4 text-small">
            {(
              [
                ['chain', 'A chain of masses and springs'],
                ['matrices', 'Full mass and stiffness matrices'],
              ] as const
            ).map(([entry, label]) => (
              <label key={entry} className="flex items-center gap-2">
                <input type="radio" name="model-entry" checked={values.entry === entry} onChange={() => switchEntry(entry)} />
                {label}
              </label>
            ))}
          </div>
          {entryProblem ? <Notice tone="caution">{entryProblem}</Notice> : null}
        </fieldset>

        {values.entry === 'chain' ? (
          <ChainInputs n={n} register={register} errors={errors} labels={values.dofLabels} />
        ) : (
          <MatrixInputs n={n} register={register} errors={errors} labels={values.dofLabels} />
        )}

        <div className="flex flex-wrap gap-3">
          <Button type="submit" busy={createModel.isPending || updateModel.isPending} disabled={Boolean(model) && !formState.isDirty}>
            {model ? 'Save model' : 'Save new model'}
          </Button>
          {onCancel ? (
            <Button tone="quiet" onClick={onCancel}>
              Cancel
            </Button>
          ) : null}
        </div>
      </form>
      <ModelResults analysis={analysis} labels={values.dofLabels.slice(0, n)} editing fromGround={values.entry === 'chain'} />
    </div>
  );
}

function ChainInputs({ n, register, errors, labels }: { n: number; register: UseFormRegister<ModelFormValues>; errors: FieldErrors<ModelFormValues>; labels: string[] }) {
  const problems = Array.from({ length: n }, (_, i) => [errorAt(errors, `massesKg.${i}`), errorAt(errors, `springsNPerM.${i}`)] as const);
  const matrixProblems = [errorAt(errors, 'massMatrixKg'), errorAt(errors, 'stiffnessMatrixNPerM')].filter(Boolean);
  return (
    <div className="flex flex-col gap-2">
      <p className="text-small text-ink-soft">
        Spring k1 ties mass m1 to the ground; spring k<sub>i</sub> ties mass m<sub>i−1</sub> to mass m<sub>i</sub>: ground — k1 — m1 — k2 — m2 — …
      </p>
      <div className="overflow-x-auto">
        <table className="text-small">
          <caption className="sr-only">Masses and springs of the chain</caption>
          <thead>
            <tr>
              <th scope="col" className={headClass}>DOF</th>
              <th scope="col" className={headClass}>Label</th>
              <th scope="col" className={headClass}>
                Mass <span className="normal-case">m</span> <Unit>kg</Unit>
              </th>
              <th scope="col" className={headClass}>
                Spring <span className="normal-case">k</span> <Unit>N/m</Unit>
              </th>
              <th scope="col" className={headClass}>Spring joins</th>
            </tr>
          </thead>
          <tbody>
            {Array.from({ length: n }, (_, i) => (
              <tr key={i}>
                <th scope="row" className="px-2 py-1 text-left font-medium text-ink-soft">
                  {i + 1}
                </th>
                <td className="px-2 py-1">
                  <input aria-label={`Label of DOF ${i + 1}`} placeholder={`DOF ${i + 1}`} className={`${cellClass} w-36 text-left`} {...register(`dofLabels.${i}`)} />
                </td>
                <td className="px-2 py-1">
                  <input aria-label={`Mass m${i + 1} [kg]`} inputMode="decimal" aria-invalid={problems[i][0] ? true : undefined} className={cellClass} {...register(`massesKg.${i}`, number)} />
                </td>
                <td className="px-2 py-1">
                  <input aria-label={`Spring k${i + 1} [N/m]`} inputMode="decimal" aria-invalid={problems[i][1] ? true : undefined} className={cellClass} {...register(`springsNPerM.${i}`, number)} />
                </td>
                <td className="px-2 py-1 text-caption text-ink-muted">{i === 0 ? `ground and ${dofName(labels, 0)}` : `${dofName(labels, i - 1)} and ${dofName(labels, i)}`}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {problems.flatMap(([mass, spring], i) => [
        mass ? <p key={`m${i}`} className="text-caption font-medium text-signal-error">Mass m{i + 1}: {mass}</p> : null,
        spring ? <p key={`k${i}`} className="text-caption font-medium text-signal-error">Spring k{i + 1}: {spring}</p> : null,
      ])}
      {matrixProblems.map((problem) => (
        <p key={problem} className="text-caption font-medium text-signal-error">
          The matrices of the chain: {problem}
        </p>
      ))}
    </div>
  );
}

function MatrixInputs({ n, register, errors, labels }: { n: number; register: UseFormRegister<ModelFormValues>; errors: FieldErrors<ModelFormValues>; labels: string[] }) {
  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap gap-3">
        {Array.from({ length: n }, (_, i) => (
          <input key={i} aria-label={`Label of DOF ${i + 1}`} placeholder={`DOF ${i + 1}`} className={`${cellClass} w-36 text-left`} {...register(`dofLabels.${i}`)} />
        ))}
      </div>
      {(
        [
          ['massMatrixKg', 'Mass matrix M [kg]', 'mass matrix'],
          ['stiffnessMatrixNPerM', 'Stiffness matrix K [N/m]', 'stiffness matrix'],
        ] as const
      ).map(([field, title, what]) => {
        const cellErrors = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => errorAt(errors, `${field}.${i}.${j}`)));
        const firstCell = cellErrors.flatMap((row, i) => row.map((message, j) => (message ? `Entry (${i + 1}, ${j + 1}): ${message}` : null))).find(Boolean);
        const matrixError = errorAt(errors, field) ?? firstCell;
        return (
          <div key={field} className="flex flex-col gap-2">
            <h3 className="text-small font-semibold text-ink-soft">{title}</h3>
            <div className="overflow-x-auto">
              <table className="text-small">
                <caption className="sr-only">{title}</caption>
                <thead>
                  <tr>
                    <td />
                    {Array.from({ length: n }, (_, j) => (
                      <th key={j} scope="col" className={headClass}>
                        <span className="normal-case">{labels[j]?.trim() || `DOF ${j + 1}`}</span>
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {Array.from({ length: n }, (_, i) => (
                    <tr key={i}>
                      <th scope="row" className="px-2 py-1 text-left text-caption font-semibold text-ink-muted">
                        {labels[i]?.trim() || `DOF ${i + 1}`}
                      </th>
                      {Array.from({ length: n }, (_, j) => (
                        <td key={j} className="px-1 py-1">
                          <input
                            aria-label={`${what} row ${i + 1} column ${j + 1}`}
                            inputMode="decimal"
                            aria-invalid={cellErrors[i][j] ? true : undefined}
                            className={cellClass}
                            {...register(`${field}.${i}.${j}`, number)}
                          />
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            {matrixError ? <p className="text-caption font-medium text-signal-error">{`The ${what}: ${matrixError}`}</p> : null}
          </div>
        );
      })}
      <p className="text-caption text-ink-muted">Both matrices must be symmetric; M positive definite, K positive semi-definite.</p>
    </div>
  );
}

/** The modes of the model as typed (table and shape plot) and its free vibration. */
export function ModelResults({ analysis, labels, editing, fromGround }: { analysis: ModelAnalysis; labels: string[]; editing: boolean; fromGround: boolean }) {
  if (!analysis.ok) {
    return (
      <Notice tone="caution" title="No modes yet">
        {analysis.problem}
      </Notice>
    );
  }
  const dofLabels = labels.map((label, i) => label?.trim() || `DOF ${i + 1}`);
  const shown = analysis.modes.shapes.slice(0, 6);
  return (
    <div className="flex flex-col gap-6">
      <section aria-label="Modes of the model" className="flex flex-col gap-4">
        <h3 className="text-body font-semibold text-ink">{editing ? 'Modes of the model, as entered' : 'Modes of the model'}</h3>
        <ModelModesTable modes={analysis.modes} dofLabels={dofLabels} />
        <ModeShapeChart
          fromGround={fromGround}
          dofLabels={dofLabels}
          modes={shown.map((shape, r) => ({ label: `Mode ${r + 1} (${formatNumber(analysis.modes.frequencyHz[r], 4)} Hz)`, shape: scaleToUnitMax(shape) }))}
          description={`Shapes of the ${shown.length === analysis.modes.dofCount ? '' : `first ${shown.length} of ${analysis.modes.dofCount} `}modes over the degrees of freedom${fromGround ? ' of the chain, from the ground (0)' : ''}, each scaled to 1 at its largest entry.`}
        />
      </section>
      <FreeVibrationPanel matrices={analysis.matrices} modes={analysis.modes} dofLabels={dofLabels} />
    </div>
  );
}

/** A saved model for readers: its matrices as tables, its modes and free vibration. */
export function LumpedModelView({ model }: { model: LumpedModel }) {
  const n = model.massMatrixKg.length;
  const labels = model.dofLabels ?? Array.from({ length: n }, (_, i) => `DOF ${i + 1}`);
  const analysis = analyseModel({ entry: 'matrices', dofLabels: labels, massesKg: [], springsNPerM: [], massMatrixKg: model.massMatrixKg, stiffnessMatrixNPerM: model.stiffnessMatrixNPerM });
  return (
    <div className="flex flex-col gap-6">
      <div className="grid gap-6 lg:grid-cols-2">
        {(
          [
            ['Mass matrix M [kg]', model.massMatrixKg],
            ['Stiffness matrix K [N/m]', model.stiffnessMatrixNPerM],
          ] as const
        ).map(([title, matrix]) => (
          <div key={title} className="flex flex-col gap-2">
            <h3 className="text-small font-semibold text-ink-soft">{title}</h3>
            <div className="overflow-x-auto">
              <table className="text-small">
                <caption className="sr-only">{title}</caption>
                <thead>
                  <tr>
                    <td />
                    {labels.map((label, j) => (
                      <th key={j} scope="col" className={headClass}>
                        <span className="normal-case">{label}</span>
                      </th>
                    ))}
                  </tr>
                </thead>
                <tbody>
                  {matrix.map((row, i) => (
                    <tr key={i}>
                      <th scope="row" className="px-2 py-1 text-left text-caption font-semibold text-ink-muted">
                        {labels[i]}
                      </th>
                      {row.map((value, j) => (
                        <td key={j} className="whitespace-nowrap px-2 py-1 text-right tabular-nums">
                          {formatNumber(value, 5)}
                        </td>
                      ))}
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </div>
        ))}
      </div>
      <ModelResults analysis={analysis} labels={labels} editing={false} fromGround={matricesToChain(model.massMatrixKg, model.stiffnessMatrixNPerM) !== null} />
    </div>
  );
}

/** A titled panel around the editor or the view. */
export function LumpedModelPanel({ title, description, children }: { title: string; description?: string; children: React.ReactNode }) {
  return (
    <Panel title={title} description={description}>
      {children}
    </Panel>
  );
}
