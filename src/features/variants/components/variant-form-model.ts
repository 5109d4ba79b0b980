import type { FieldErrors, Resolver } from 'react-hook-form';
import {
  createVariantSchema,
  DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO,
  toApiIssues,
  type ApiIssue,
  type CreateVariantInput,
  type TuningMethod,
  type UpdateVariantInput,
  type Variant,
} from '../../../../shared/contracts';
import { numberOrUndefined } from '../../../lib/form-values';
import { fromDisplay, toDisplay, type UnitSystem } from '../../../lib/units';

/**
 * What the variant form holds: numbers as the engineer types them (percentages for ratios, the stroke limit in the
 * display unit). `toVariantInput` converts them to the API's SI request, which the contract schema — the server's
 * own — then checks; its issues come back to the fields here.
 */
export interface VariantFormValues {
  name: string;
  modeId: string;
  loadCaseIds: string[];
  criteriaId: string;
  massRatioPercent: string | number;
  tuningKind: 'method' | 'manual';
  method: TuningMethod;
  frequencyHz: string | number;
  dampingRatioPercent: string | number;
  unitCount: string | number;
  structureFrequencyTolerancePercent: string | number;
  tmdDampingTolerancePercent: string | number;
  springsPerUnit: string | number;
  strokeMarginFactor: string | number;
  strokeLimit: string | number;
  notes: string;
}

export const variantFormFields = [
  'name',
  'modeId',
  'loadCaseIds',
  'criteriaId',
  'massRatioPercent',
  'method',
  'frequencyHz',
  'dampingRatioPercent',
  'unitCount',
  'structureFrequencyTolerancePercent',
  'tmdDampingTolerancePercent',
  'springsPerUnit',
  'strokeMarginFactor',
  'strokeLimit',
  'notes',
] as const satisfies readonly (keyof VariantFormValues)[];
export type VariantFormField = (typeof variantFormFields)[number];

const percent = (value: string | number) => {
  const n = numberOrUndefined(value);
  return n === undefined ? undefined : n / 100;
};

/** The API request (SI) from the form's values. */
export function toVariantInput(values: VariantFormValues, system: UnitSystem): CreateVariantInput {
  const strokeLimit = numberOrUndefined(values.strokeLimit);
  const hardware: CreateVariantInput['hardware'] = {};
  const springs = numberOrUndefined(values.springsPerUnit);
  const margin = numberOrUndefined(values.strokeMarginFactor);
  if (springs !== undefined) hardware.springsPerUnit = springs;
  if (margin !== undefined) hardware.strokeMarginFactor = margin;
  if (strokeLimit !== undefined) hardware.strokeLimitM = fromDisplay('displacement', strokeLimit, system);
  const tolerance = percent(values.structureFrequencyTolerancePercent);
  const dampingTolerance = percent(values.tmdDampingTolerancePercent);
  const notes = values.notes.trim();
  return {
    name: values.name,
    modeId: values.modeId,
    loadCaseIds: values.loadCaseIds,
    criteriaId: values.criteriaId,
    massRatio: percent(values.massRatioPercent) as number,
    tuning:
      values.tuningKind === 'method'
        ? { method: values.method }
        : { frequencyHz: numberOrUndefined(values.frequencyHz) as number, dampingRatio: percent(values.dampingRatioPercent) as number },
    unitCount: numberOrUndefined(values.unitCount) ?? 1,
    structureFrequencyToleranceRatio: tolerance ?? DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO,
    ...(dampingTolerance === undefined ? {} : { tmdDampingToleranceRatio: dampingTolerance }),
    hardware,
    ...(notes ? { notes } : {}),
  };
}

/** The PATCH of a stored variant: every field of the form, with the version read. */
export function toVariantUpdate(values: VariantFormValues, system: UnitSystem, version: number): UpdateVariantInput {
  const input = toVariantInput(values, system);
  return {
    ...input,
    version,
    tmdDampingToleranceRatio: input.tmdDampingToleranceRatio ?? null,
    notes: input.notes ?? null,
  };
}

/** The form field that shows an issue of the request at `path` ("tuning.frequencyHz" → frequencyHz). */
export function formFieldOf(path: string): VariantFormField | null {
  const [head, second] = path.split('.');
  switch (head) {
    case 'massRatio':
      return 'massRatioPercent';
    case 'tuning':
      return second === 'frequencyHz' ? 'frequencyHz' : second === 'dampingRatio' ? 'dampingRatioPercent' : 'method';
    case 'structureFrequencyToleranceRatio':
      return 'structureFrequencyTolerancePercent';
    case 'tmdDampingToleranceRatio':
      return 'tmdDampingTolerancePercent';
    case 'hardware':
      return second === 'strokeLimitM' ? 'strokeLimit' : second === 'springsPerUnit' ? 'springsPerUnit' : second === 'strokeMarginFactor' ? 'strokeMarginFactor' : null;
    default:
      return (variantFormFields as readonly string[]).includes(head) ? (head as VariantFormField) : null;
  }
}

/** An issue's message without the request path in front ("massRatio: must be …" → "must be …"). */
function bareMessage(issue: ApiIssue): string {
  return issue.path && issue.message.startsWith(`${issue.path}: `) ? issue.message.slice(issue.path.length + 2) : issue.message;
}

/** Issues placed under their fields (the first per field), and the rest. */
export function placeIssues(issues: readonly ApiIssue[]): { fields: Partial<Record<VariantFormField, string>>; rest: string[] } {
  const fields: Partial<Record<VariantFormField, string>> = {};
  const rest: string[] = [];
  for (const issue of issues) {
    const field = formFieldOf(issue.path);
    if (field) {
      if (!fields[field]) fields[field] = bareMessage(issue);
    } else rest.push(issue.message);
  }
  return { fields, rest };
}

/**
 * The form's resolver: converts to the SI request and checks it with the contract schema the server uses. Ratios are
 * typed in percent, so a rule on a ratio ("at most 0.25") is shown with its percentage beside it.
 */
export function variantResolver(system: UnitSystem): Resolver<VariantFormValues> {
  return async (values) => {
    const parsed = createVariantSchema.safeParse(toVariantInput(values, system));
    if (parsed.success) return { values, errors: {} };
    const { fields } = placeIssues(toApiIssues(parsed.error));
    const errors: FieldErrors<VariantFormValues> = {};
    for (const [field, message] of Object.entries(fields)) {
      (errors as Record<string, { type: string; message: string }>)[field] = { type: 'schema', message: withPercent(field as VariantFormField, message as string) };
    }
    return { values: {}, errors };
  };
}

function withPercent(field: VariantFormField, message: string): string {
  if (!field.endsWith('Percent')) return message;
  return message.replace(/(at most|at least|greater than|less than) (\d+(?:\.\d+)?)(?![\d.]* ?%)/g, (_all, rule: string, value: string) => `${rule} ${value} (${Number(value) * 100} %)`);
}

/** The form's values of a stored variant, in the display units. */
export function variantToForm(variant: Variant, system: UnitSystem): VariantFormValues {
  const tuning = variant.tuning;
  const manual = !('method' in tuning);
  const round = (value: number, digits = 6) => Number(value.toPrecision(digits));
  return {
    name: variant.name,
    modeId: variant.modeId,
    loadCaseIds: variant.loadCaseIds,
    criteriaId: variant.criteriaId,
    massRatioPercent: round(variant.massRatio * 100),
    tuningKind: manual ? 'manual' : 'method',
    method: manual ? 'den-hartog' : tuning.method,
    frequencyHz: manual ? tuning.frequencyHz : variant.result ? round(variant.result.tmd.frequencyHz, 5) : '',
    dampingRatioPercent: manual ? round(tuning.dampingRatio * 100) : variant.result ? round(variant.result.tmd.dampingRatio * 100, 4) : '',
    unitCount: variant.unitCount,
    structureFrequencyTolerancePercent: round(variant.structureFrequencyToleranceRatio * 100),
    tmdDampingTolerancePercent: variant.tmdDampingToleranceRatio === null ? '' : round(variant.tmdDampingToleranceRatio * 100),
    springsPerUnit: variant.hardware.springsPerUnit ?? '',
    strokeMarginFactor: variant.hardware.strokeMarginFactor ?? '',
    strokeLimit: variant.hardware.strokeLimitM === undefined ? '' : round(toDisplay('displacement', variant.hardware.strokeLimitM, system), 5),
    notes: variant.notes ?? '',
  };
}

export function emptyVariantForm(defaults: { modeId?: string; loadCaseIds?: string[]; criteriaId?: string; name?: string }): VariantFormValues {
  return {
    name: defaults.name ?? '',
    modeId: defaults.modeId ?? '',
    loadCaseIds: defaults.loadCaseIds ?? [],
    criteriaId: defaults.criteriaId ?? '',
    massRatioPercent: 2,
    tuningKind: 'method',
    method: 'den-hartog',
    frequencyHz: '',
    dampingRatioPercent: '',
    unitCount: 1,
    structureFrequencyTolerancePercent: DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO * 100,
    tmdDampingTolerancePercent: '',
    springsPerUnit: '',
    strokeMarginFactor: '',
    strokeLimit: '',
    notes: '',
  };
}
