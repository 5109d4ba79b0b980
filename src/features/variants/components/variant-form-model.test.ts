import { describe, expect, it } from 'vitest';
import { createVariantSchema } from '../../../../shared/contracts';
import { emptyVariantForm, formFieldOf, placeIssues, toVariantInput, variantResolver } from './variant-form-model';

const ids = {
  modeId: '3f8a1c2e-4b5d-4e6f-8a7b-9c0d1e2f3a4b',
  loadCaseIds: ['5a6b7c8d-9e0f-4a1b-8c2d-3e4f5a6b7c8d'],
  criteriaId: '7c8d9e0f-1a2b-4c3d-9e4f-5a6b7c8d9e0f',
};

describe('variant form model', () => {
  it('sends ratios typed in percent as fractions, and the hardware travel typed in inches as metres (1 in = 0.0254 m, NIST SP 811)', () => {
    const values = { ...emptyVariantForm({ ...ids, name: 'Invented trial' }), massRatioPercent: '2.5', strokeLimit: '2', tmdDampingTolerancePercent: '20' };
    const input = toVariantInput(values, 'us-customary');
    expect(input.massRatio).toBeCloseTo(0.025, 15);
    expect(input.hardware?.strokeLimitM).toBeCloseTo(0.0508, 15);
    expect(input.tmdDampingToleranceRatio).toBeCloseTo(0.2, 15);
    expect(input.structureFrequencyToleranceRatio).toBeCloseTo(0.1, 15);
    expect(createVariantSchema.safeParse(input).success).toBe(true);
    // The same number typed under SI is millimetres.
    expect(toVariantInput(values, 'si').hardware?.strokeLimitM).toBeCloseTo(0.002, 15);
  });

  it('sends a hand tuning as the damper frequency and its damping ratio as a fraction', () => {
    const values = { ...emptyVariantForm({ ...ids, name: 'Invented trial' }), tuningKind: 'manual' as const, frequencyHz: '1.8', dampingRatioPercent: '9' };
    expect(toVariantInput(values, 'si').tuning).toEqual({ frequencyHz: 1.8, dampingRatio: 0.09 });
  });

  it('puts the contract schema’s issues under the form fields, rules on a ratio with their percentage', async () => {
    const values = { ...emptyVariantForm({ ...ids, name: '' }), massRatioPercent: '30' };
    const answer = await variantResolver('si')(values, undefined, { fields: {}, shouldUseNativeValidation: false });
    expect(answer.errors.name?.message).toBe('is required');
    expect(answer.errors.massRatioPercent?.message).toMatch(/at most 0\.25 \(25 %\)/);
  });

  it('maps request paths to fields, and keeps what has no field for the notice', () => {
    expect(formFieldOf('tuning.dampingRatio')).toBe('dampingRatioPercent');
    expect(formFieldOf('hardware.strokeLimitM')).toBe('strokeLimit');
    expect(formFieldOf('loadCaseIds.1')).toBe('loadCaseIds');
    const placed = placeIssues([
      { path: 'massRatio', message: 'massRatio: must be at most 0.25' },
      { path: 'version', message: 'version: is stale' },
    ]);
    expect(placed.fields).toEqual({ massRatioPercent: 'must be at most 0.25' });
    expect(placed.rest).toEqual(['version: is stale']);
  });
});
