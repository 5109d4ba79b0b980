/**
 * The model editor's form: a chain (masses and springs) or full matrices, read into the contract's body
 * (createLumpedModelSchema) and checked by the contract itself through zodResolver. In chain entry the contract's
 * complaints about matrix entries are moved to the mass or spring they come from.
 */
import { toNestErrors } from '@hookform/resolvers';
import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldError, FieldErrors, Resolver } from 'react-hook-form';
import { createLumpedModelSchema, type CreateLumpedModelInput, type LumpedModel, type UpdateLumpedModelInput } from '../../../../shared/contracts';
import type { ModelEntry } from './lumped-model-analysis';
import { chainMatrices, matricesToChain } from './lumped-model-math';

type Entry = number | undefined;

export interface ModelFormValues {
  name: string;
  entry: ModelEntry;
  dofLabels: string[];
  massesKg: Entry[];
  springsNPerM: Entry[];
  massMatrixKg: Entry[][];
  stiffnessMatrixNPerM: Entry[][];
}

/** Largest model the editor lays out as input boxes. */
export const MAX_EDITOR_DOF = 12;

const square = (n: number, fill: (i: number, j: number) => Entry): Entry[][] =>
  Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => fill(i, j)));

export function emptyModelForm(dofCount = 2): ModelFormValues {
  return {
    name: '',
    entry: 'chain',
    dofLabels: Array.from({ length: dofCount }, () => ''),
    massesKg: new Array<Entry>(dofCount).fill(undefined),
    springsNPerM: new Array<Entry>(dofCount).fill(undefined),
    massMatrixKg: square(dofCount, () => undefined),
    stiffnessMatrixNPerM: square(dofCount, () => undefined),
  };
}

/** A saved model in the editor: as a chain when its matrices are a chain's, else as matrices. */
export function modelToForm(model: LumpedModel): ModelFormValues {
  const n = model.massMatrixKg.length;
  const chain = matricesToChain(model.massMatrixKg, model.stiffnessMatrixNPerM);
  return {
    name: model.name,
    entry: chain ? 'chain' : 'matrices',
    dofLabels: model.dofLabels ? [...model.dofLabels] : Array.from({ length: n }, () => ''),
    massesKg: chain ? chain.massesKg : model.massMatrixKg.map((row, i) => row[i]),
    springsNPerM: chain ? chain.springsNPerM : new Array<Entry>(n).fill(undefined),
    massMatrixKg: model.massMatrixKg.map((row) => [...row]),
    stiffnessMatrixNPerM: model.stiffnessMatrixNPerM.map((row) => [...row]),
  };
}

export function dofCountOf(values: Pick<ModelFormValues, 'entry' | 'massesKg' | 'massMatrixKg'>): number {
  return values.entry === 'chain' ? values.massesKg.length : values.massMatrixKg.length;
}

/** The same values with `n` degrees of freedom: entries kept where they exist, new ones empty. */
export function resizeModelForm(values: ModelFormValues, n: number): ModelFormValues {
  const vector = <T>(list: T[], fill: T) => Array.from({ length: n }, (_, i) => (i < list.length ? list[i] : fill));
  const grow = (matrix: Entry[][]) => square(n, (i, j) => matrix[i]?.[j] ?? (i === j || values.entry === 'chain' ? undefined : 0));
  return {
    ...values,
    dofLabels: vector(values.dofLabels, ''),
    massesKg: vector(values.massesKg, undefined),
    springsNPerM: vector(values.springsNPerM, undefined),
    massMatrixKg: grow(values.massMatrixKg),
    stiffnessMatrixNPerM: grow(values.stiffnessMatrixNPerM),
  };
}

/** Labels as the contract wants them: left out when all are blank, a blank one named by its number otherwise. */
function cleanLabels(labels: string[], n: number): string[] | undefined {
  const trimmed = labels.slice(0, n).map((label) => label.trim());
  if (trimmed.every((label) => label === '')) return undefined;
  return trimmed.map((label, i) => label || `DOF ${i + 1}`);
}

/** The request body of the form's values (matrices built from the chain in chain entry). */
export function modelBody(values: ModelFormValues): CreateLumpedModelInput {
  const n = dofCountOf(values);
  const matrices =
    values.entry === 'chain'
      ? chainMatrices(values.massesKg.slice(0, n) as number[], values.springsNPerM.slice(0, n) as number[])
      : { massMatrixKg: values.massMatrixKg as number[][], stiffnessMatrixNPerM: values.stiffnessMatrixNPerM as number[][] };
  return { name: values.name, ...matrices, dofLabels: cleanLabels(values.dofLabels, n) };
}

export function modelChanges(values: ModelFormValues, version: number): UpdateLumpedModelInput {
  const body = modelBody(values);
  return { version, name: body.name, massMatrixKg: body.massMatrixKg, stiffnessMatrixNPerM: body.stiffnessMatrixNPerM, dofLabels: body.dofLabels ?? null };
}

/** Leaf errors of a nested error object with their dotted paths. */
function flattenErrors(errors: FieldErrors, prefix = ''): { path: string; error: FieldError }[] {
  const found: { path: string; error: FieldError }[] = [];
  for (const [key, value] of Object.entries(errors)) {
    if (!value || key === 'ref') continue;
    const path = prefix ? `${prefix}.${key}` : key;
    if (typeof (value as FieldError).message === 'string' && typeof (value as FieldError).type === 'string') found.push({ path, error: value as FieldError });
    else if (typeof value === 'object') found.push(...flattenErrors(value as FieldErrors, path));
  }
  return found;
}

/** Where a contract issue about the built matrices belongs in chain entry. */
export function chainPath(path: string): string {
  const match = /^(massMatrixKg|stiffnessMatrixNPerM)\.(\d+)(?:\.(\d+))?/.exec(path);
  if (!match) return path;
  const i = Number(match[2]);
  const j = match[3] === undefined ? i : Number(match[3]);
  // A mass sits on the diagonal; spring k_(j+1) joins i and j = i + 1 (or k_(i+1) on the diagonal, the larger index first).
  return match[1] === 'massMatrixKg' ? `massesKg.${i}` : `springsNPerM.${Math.max(i, j)}`;
}

const contractResolver = zodResolver(createLumpedModelSchema);

/** zodResolver of the contract, run on the body the form's values make. */
export const modelFormResolver: Resolver<ModelFormValues, unknown, CreateLumpedModelInput> = async (values, context, options) => {
  const body = modelBody(values);
  const result = await contractResolver(body, context, { ...options, fields: {}, names: undefined } as never);
  const issues = flattenErrors(result.errors as FieldErrors);
  if (issues.length === 0) return { values: body, errors: {} };
  const moved: Record<string, FieldError> = {};
  for (const { path, error } of issues) {
    const target = values.entry === 'chain' ? chainPath(path) : path;
    if (!moved[target]) moved[target] = { type: error.type, message: error.message };
  }
  return { values: {}, errors: toNestErrors(moved as FieldErrors, options) };
};
