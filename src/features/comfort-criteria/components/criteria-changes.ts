import type { ComfortCriteria, CreateComfortCriteriaInput, UpdateComfortCriteriaInput } from '../../../../shared/contracts';
import { criteriaSchema } from '../../../../shared/contracts/compute-design';
import { sameValue } from '../../../components/forms/changes';
import type { CriteriaFormValues } from './criteria-form';

/** Stored comfort criteria as the form's values (SI: the custom limit stays in m/s²). */
export function criteriaToForm(criteria: ComfortCriteria): CriteriaFormValues {
  return { name: criteria.name, spec: { ...criteria.spec } };
}

/**
 * The PATCH body of a change to `criteria` (as the form was opened on them) from the body the form makes: the version,
 * the name when it differs, and the whole spec when any of it differs (a spec is replaced as a whole). Specs are
 * compared as the engine's schema reads them, so a default written out is no change.
 */
export function criteriaChanges(criteria: ComfortCriteria, body: CreateComfortCriteriaInput): UpdateComfortCriteriaInput {
  const changes: UpdateComfortCriteriaInput = { version: criteria.version };
  const name = body.name.trim();
  if (name !== criteria.name) changes.name = name;
  const parsed = criteriaSchema.safeParse(body.spec);
  if (!parsed.success || !sameValue(parsed.data, criteria.spec)) changes.spec = body.spec;
  return changes;
}
