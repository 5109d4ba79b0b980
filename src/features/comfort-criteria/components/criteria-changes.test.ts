import { describe, expect, it } from 'vitest';
import { createComfortCriteriaSchema, updateComfortCriteriaSchema, type ComfortCriteria } from '../../../../shared/contracts';
import { criteriaChanges, criteriaToForm } from './criteria-changes';
import { criteriaBody, type CriteriaFormValues } from './criteria-form';

// Invented criteria; SI throughout (m/s²).
const record = { version: 5, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z', createdBy: null, projectId: 'p', status: 'draft' as const };
const codeLimit: ComfortCriteria = { ...record, id: 'en', name: 'Code limit', spec: { set: 'en1990', class: 'normal-use' } };
const custom: ComfortCriteria = { ...record, id: 'custom', name: 'Specification limit', spec: { set: 'custom', peakAccelerationLimitMPerS2: 0.5 } };

/** What the form hands over on submit: the body its values make, read by the create schema, as the resolver does. */
const submitted = (values: CriteriaFormValues) => createComfortCriteriaSchema.parse(criteriaBody(values));

describe('criteriaToForm and criteriaChanges', () => {
  it('opens criteria without change: the body names only the version', () => {
    for (const criteria of [codeLimit, custom]) expect(criteriaChanges(criteria, submitted(criteriaToForm(criteria)))).toEqual({ version: 5 });
  });

  it('sends the whole spec when the class changed', () => {
    // EN 1990 A2.4.3.2 situations: normal use and exceptional crowd (PRODUCT spec: confirmed).
    const body = criteriaChanges(codeLimit, submitted({ ...criteriaToForm(codeLimit), spec: { set: 'en1990', class: 'crowd' } }));
    expect(body).toEqual({ version: 5, spec: { set: 'en1990', class: 'crowd' } });
    expect(updateComfortCriteriaSchema.safeParse(body).success).toBe(true);
  });

  it('keeps a custom limit in m/s² and sends only the name when only the name changed', () => {
    expect(criteriaToForm(custom).spec.peakAccelerationLimitMPerS2).toBe(0.5);
    expect(criteriaChanges(custom, submitted({ ...criteriaToForm(custom), name: 'Specification limit, rev. B' }))).toEqual({ version: 5, name: 'Specification limit, rev. B' });
    const body = criteriaChanges(custom, submitted({ ...criteriaToForm(custom), spec: { set: 'custom', peakAccelerationLimitMPerS2: 0.4 } }));
    expect(body).toEqual({ version: 5, spec: { set: 'custom', peakAccelerationLimitMPerS2: 0.4 } });
  });

  it('sends a switch from a code limit to custom numbers without the old class', () => {
    const body = criteriaChanges(codeLimit, submitted({ name: 'Code limit', spec: { set: 'custom', class: 'normal-use', peakAccelerationLimitMPerS2: 0.6 } }));
    expect(body).toEqual({ version: 5, spec: { set: 'custom', peakAccelerationLimitMPerS2: 0.6 } });
    expect(updateComfortCriteriaSchema.safeParse(body).success).toBe(true);
  });
});
