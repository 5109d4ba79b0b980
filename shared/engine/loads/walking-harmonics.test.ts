import { describe, expect, it } from 'vitest';
import { bachmannAmmannLateralLoadFactor, findGaitLoadModel, harmonicBandHz } from './walking-harmonics';

describe('walking and jogging load models', () => {
  it('lateral walking: 3.9 % of body weight at half the pacing frequency', () => {
    // Bachmann & Ammann's lateral factor as tabulated in Macdonald, Proc. R. Soc. A 465 (2009), table 2 (Dallard et
    // al. 2001: 4 %); the details are in tests/reference/loads-walking-harmonics.test.ts.
    expect(bachmannAmmannLateralLoadFactor).toBe(0.039);
    const model = findGaitLoadModel('walking', 'lateral');
    expect(model?.harmonics).toEqual([{ frequencyMultiple: 0.5, dynamicLoadFactor: 0.039 }]);
    expect(harmonicBandHz(model!.harmonics[0], model!.pacingRangeHz)).toEqual([0.8, 1.2]);
  });

  it('a torsional mode gets the vertical model', () => {
    expect(findGaitLoadModel('walking', 'torsional')).toBe(findGaitLoadModel('walking', 'vertical'));
    expect(findGaitLoadModel('jogging', 'torsional')).toBe(findGaitLoadModel('jogging', 'vertical'));
    expect(findGaitLoadModel('jogging', 'lateral')).toBeUndefined();
  });

  it('names the values that are from memory', () => {
    expect(findGaitLoadModel('jogging', 'vertical')?.notConfirmed.map((v) => v.note).join(' ')).toMatch(/1\.6 \/ 0\.7 \/ 0\.2/);
    expect(findGaitLoadModel('walking', 'vertical')?.notConfirmed.map((v) => v.note).join(' ')).toMatch(/800 N/);
    // The vertical walking factors and the lateral 3.9 % are confirmed, so they are not in the list.
    expect(findGaitLoadModel('walking', 'lateral')?.notConfirmed.map((v) => v.note).join(' ')).not.toMatch(/0\.039|3\.9/);
  });
});
