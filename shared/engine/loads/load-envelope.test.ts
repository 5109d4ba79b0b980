import { describe, expect, it } from 'vitest';
import { buildLoadEnvelope, LoadCaseError, type EnvelopeStructure, type SteadyLoadCase } from './load-envelope';

// Invented modes.
const vertical: EnvelopeStructure = { modalMassKg: 50000, frequencyHz: 3.8, dampingRatio: 0.005, direction: 'vertical' };
const lateral: EnvelopeStructure = { modalMassKg: 90000, frequencyHz: 0.9, dampingRatio: 0.008, direction: 'lateral' };
const torsional: EnvelopeStructure = { modalMassKg: 30000, frequencyHz: 2.0, dampingRatio: 0.006, direction: 'torsional' };

function refusal(structure: EnvelopeStructure, loadCase: SteadyLoadCase): LoadCaseError {
  try {
    buildLoadEnvelope(structure, loadCase);
  } catch (error) {
    if (error instanceof LoadCaseError) return error;
    throw error;
  }
  throw new Error('expected a LoadCaseError');
}

const codes = (structure: EnvelopeStructure, loadCase: SteadyLoadCase) => buildLoadEnvelope(structure, loadCase).warnings.map((w) => w.code);

describe('crowd: harmonic 1 by default, harmonic 2 on request', () => {
  it('the first harmonic is the default and gives the first-harmonic band', () => {
    const e = buildLoadEnvelope(vertical, { kind: 'crowd', guide: 'hivoss', densityPerM2: 0.5, deckAreaM2: 400 });
    expect([e.bands[0].loHz, e.bands[0].hiHz]).toEqual([1.25, 2.3]);
    // 3.8 Hz lies in the second-harmonic range: the answer says to assess harmonic 2.
    expect(e.warnings.map((w) => w.code)).toContain('second-harmonic-range');
  });

  it('HiVoSS second harmonic: band 2.5–4.6 Hz, force 280 N × 0.25 × n\' × mean|φ| on the plateau, no from-memory warning', () => {
    const e = buildLoadEnvelope(vertical, { kind: 'crowd', guide: 'hivoss', densityPerM2: 0.5, deckAreaM2: 400, harmonic: 2 });
    expect([e.bands[0].loHz, e.bands[0].hiHz]).toEqual([2.5, 4.6]);
    const nEq = 10.8 * Math.sqrt(0.005 * 200);
    expect(e.bands[0].forceN(3.8)).toBeCloseTo(280 * 0.25 * nEq * (2 / Math.PI), 9);
    expect(e.warnings).toEqual([]);
    expect(e.source).toMatch(/linear ramps/);
  });

  it('Sétra second harmonic: 70 N, band 2.6–5 Hz, and the answer says its ψ shape is assumed', () => {
    const e = buildLoadEnvelope(vertical, { kind: 'crowd', guide: 'setra', trafficClass: 'II', deckAreaM2: 400, harmonic: 2 });
    expect([e.bands[0].loHz, e.bands[0].hiHz]).toEqual([2.6, 5.0]);
    expect(e.bands[0].forceN(3.8)).toBeCloseTo(70 * 10.8 * Math.sqrt(0.005 * 320) * (2 / Math.PI), 9);
    const warning = e.warnings.find((w) => w.code === 'psi-shape-assumed');
    expect(warning?.message).toMatch(/from memory/);
    expect(e.source).toMatch(/assumed \(from memory\)/);
  });

  it('Sétra second harmonic lateral: 7 N per person, the lateral range flagged as assumed', () => {
    const mode = { ...lateral, frequencyHz: 1.9 };
    const e = buildLoadEnvelope(mode, { kind: 'crowd', guide: 'setra', trafficClass: 'I', deckAreaM2: 324, harmonic: 2 });
    expect(e.bands[0].forceN(1.9)).toBeCloseTo(7 * 1.85 * 18 * (2 / Math.PI), 9);
    expect(e.warnings.find((w) => w.code === 'psi-shape-assumed')?.message).toMatch(/lateral frequency range/);
  });

  it('refuses what the guides do not define, naming the field', () => {
    expect(refusal(vertical, { kind: 'crowd', guide: 'setra', trafficClass: 'III', deckAreaM2: 400, harmonic: 2 }).path).toBe('loadCase.trafficClass');
    const dense = refusal(vertical, { kind: 'crowd', guide: 'setra', densityPerM2: 0.5, deckAreaM2: 400, harmonic: 2 });
    expect(dense.path).toBe('loadCase.densityPerM2');
    expect(dense.message).toMatch(/classes II \(0\.8 P\/m²\) and I/);
    const hivossLateral = refusal({ ...lateral, frequencyHz: 1.9 }, { kind: 'crowd', guide: 'hivoss', densityPerM2: 0.5, deckAreaM2: 400, harmonic: 2 });
    expect(hivossLateral.path).toBe('loadCase.harmonic');
    // Sétra class II's density (0.8 P/m²) given as a number is accepted.
    expect(() => buildLoadEnvelope(vertical, { kind: 'crowd', guide: 'setra', densityPerM2: 0.8, deckAreaM2: 400, harmonic: 2 })).not.toThrow();
  });

  it('the lateral case outside 0.5–1.0 Hz says that k = 300 N s/m is extrapolated (Dallard et al. 2001)', () => {
    const high = { ...lateral, frequencyHz: 1.9 };
    expect(codes(high, { kind: 'lateral', guide: 'setra', trafficClass: 'II', deckAreaM2: 400, harmonic: 2 })).toContain('lock-in-coefficient-range');
    expect(codes(lateral, { kind: 'lateral', guide: 'setra', trafficClass: 'II', deckAreaM2: 400 })).not.toContain('lock-in-coefficient-range');
    expect(codes(high, { kind: 'lateral', guide: 'setra', trafficClass: 'II', deckAreaM2: 400, harmonic: 2, lockInCoefficientNsPerM: 150 }))
      .not.toContain('lock-in-coefficient-range');
  });

  it('longitudinal modes carry the caution that the vertical ψ is used for them', () => {
    const mode = { ...vertical, frequencyHz: 1.9, direction: 'longitudinal' as const };
    expect(codes(mode, { kind: 'crowd', guide: 'hivoss', densityPerM2: 0.5, deckAreaM2: 400 })).toContain('load-value-from-memory');
  });
});

describe('torsional modes', () => {
  it('crowd: vertical force on the given mean |φ|', () => {
    const e = buildLoadEnvelope(torsional, { kind: 'crowd', guide: 'hivoss', densityPerM2: 1.0, deckAreaM2: 400, modeShapeMean: 1 / Math.PI });
    // 280 N × ψ(1.9 Hz) = 1 × 1.85 √400 × 1/π.
    expect(e.bands[0].forceN(1.9)).toBeCloseTo((280 * 37) / Math.PI, 9);
    expect(e.source).toMatch(/torsional mode/);
  });

  it('crowd without modeShapeMean, the lateral case and DG11 floor walking are refused by field', () => {
    expect(refusal(torsional, { kind: 'crowd', guide: 'hivoss', densityPerM2: 1.0, deckAreaM2: 400 }).path).toBe('loadCase.modeShapeMean');
    expect(refusal(torsional, { kind: 'lateral', guide: 'setra', densityPerM2: 1.0, deckAreaM2: 400 }).path).toBe('structure.direction');
    expect(refusal({ ...torsional, frequencyHz: 5 }, { kind: 'floor-walking' }).path).toBe('structure.direction');
  });

  it('walker: the vertical Bachmann & Ammann factors at |φ| where the person walks', () => {
    const e = buildLoadEnvelope(torsional, { kind: 'walker', modeShapeValue: 0.5 });
    expect(e.bands.map((b) => b.forceN(2))).toEqual([0.4 * 800 * 0.5, 0.1 * 800 * 0.5, 0.1 * 800 * 0.5]);
  });
});

describe('values from memory are named in the answer', () => {
  it('walker and jogger list theirs; a weight and band given in the request drop out', () => {
    const jog = buildLoadEnvelope(vertical, { kind: 'jogger' }).warnings;
    expect(jog.map((w) => w.code)).toEqual(['load-value-from-memory']);
    expect(jog[0].message).toMatch(/1\.6 \/ 0\.7 \/ 0\.2/);
    const walk = buildLoadEnvelope(vertical, { kind: 'walker', bodyWeightN: 700, pacingRangeHz: [1.7, 2.3] }).warnings;
    expect(walk).toEqual([]);
  });

  it('DG11 floor walking names its step band, harmonics and 3 Hz bound', () => {
    const floor = { ...vertical, frequencyHz: 6 };
    const [w] = buildLoadEnvelope(floor, { kind: 'floor-walking' }).warnings;
    expect(w.message).toMatch(/1\.6–2\.2 Hz/);
    expect(w.message).toMatch(/3 Hz/);
  });

  it('harmonic load and a confirmed crowd model carry none', () => {
    expect(codes(vertical, { kind: 'harmonic', modalForceAmplitudeN: 100, pacingRangeHz: [3, 4] })).toEqual([]);
    expect(codes({ ...vertical, frequencyHz: 1.9 }, { kind: 'crowd', guide: 'setra', densityPerM2: 0.5, deckAreaM2: 400 })).toEqual([]);
  });
});
