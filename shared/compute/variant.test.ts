import { describe, expect, it } from 'vitest';
import { computeVariantCurves, computeVariantResult, computeVariantSize, sampleAdaptively, tuneVariantDamper, type VariantComputeInput, type VariantLoadCaseInput } from './variant';
import { designCommands } from './design-commands';
import { ComputeInputError } from './types';

// An invented footbridge mode and load cases (test values only, not from any project).
const mode = { modalMassKg: 30_000, frequencyHz: 2.0, dampingRatio: 0.005, direction: 'vertical' as const, modeShapeMean: 0.6 };
const crowd = { id: 'lc-crowd', name: 'crowd', spec: { kind: 'crowd' as const, guide: 'setra' as const, densityPerM2: 0.8, deckAreaM2: 120, harmonic: 1 as const } };
const walker = { id: 'lc-walker', name: 'walker', spec: { kind: 'walker' as const } };
const input = (over: Partial<VariantComputeInput['variant']> = {}, loadCases: VariantLoadCaseInput[] = [crowd, walker]): VariantComputeInput => ({
  mode,
  loadCases,
  criteria: { spec: { set: 'setra', class: 'maximum' } },
  variant: { massRatio: 0.02, tuning: { method: 'den-hartog' }, unitCount: 2, structureFrequencyToleranceRatio: 0.1, ...over },
});

describe('tuneVariantDamper', () => {
  it('gives Den Hartog’s tuning: f_a = f_s/(1+μ), ζ_a = √(3μ/(8(1+μ))) referred to the damper’s own frequency', () => {
    // Den Hartog, Mechanical Vibrations, 4th ed. (1956), the optimum of a damper on an undamped primary.
    const mu = 0.02;
    const tmd = tuneVariantDamper(mode, mu, { method: 'den-hartog' });
    expect(tmd.massKg).toBeCloseTo(mu * 30_000, 9);
    expect(tmd.frequencyHz).toBeCloseTo(2.0 / 1.02, 12);
    expect(tmd.dampingRatio).toBeCloseTo(Math.sqrt((3 * mu) / (8 * 1.02)), 12);
  });
  it('keeps a manual tuning as given', () => {
    expect(tuneVariantDamper(mode, 0.03, { frequencyHz: 1.9, dampingRatio: 0.08 })).toEqual({ massKg: 900, frequencyHz: 1.9, dampingRatio: 0.08 });
  });
});

describe('computeVariantResult', () => {
  it('answers each load case with the numbers of the assess command on the same request', () => {
    const result = computeVariantResult(input());
    const tmd = result.tmd;
    for (const lc of result.loadCases) {
      const spec = lc.loadCaseId === 'lc-crowd' ? { ...crowd.spec, modeShapeMean: 0.6 } : walker.spec;
      const request = designCommands.assess.request.parse({
        structure: { modalMassKg: 30_000, frequencyHz: 2.0, dampingRatio: 0.005, direction: 'vertical' },
        tmds: [tmd],
        loadCase: spec,
        criteria: { set: 'setra', class: 'maximum' },
        hardware: { unitCount: 2 },
      });
      const answer = designCommands.assess.run(request);
      expect(lc.peakAccelerationMPerS2).toBe(answer.peakAccelerationMPerS2);
      expect(lc.utilisation).toBe(answer.utilisation);
      expect(lc.tmdStrokeM).toEqual(answer.tmdStrokeM);
      expect(lc.hardware[0].perUnit.movingMassKg).toBeCloseTo(tmd.massKg / 2, 9);
    }
    const worst = result.loadCases.reduce((a, b) => ((b.utilisation ?? 0) > (a.utilisation ?? 0) ? b : a));
    expect(result.governing.loadCaseId).toBe(worst.loadCaseId);
  });

  it('finds the detuned worst at least as high as the nominal, and as high as assess at either edge of the band', () => {
    const result = computeVariantResult(input());
    expect(result.detuning.worstUtilisation).toBeGreaterThanOrEqual(result.governing.utilisation * (1 - 1e-9));
    for (const factor of [0.9, 1.1]) {
      for (const [i, spec] of [{ ...crowd.spec, modeShapeMean: 0.6 }, walker.spec].entries()) {
        const answer = designCommands.assess.run(
          designCommands.assess.request.parse({
            structure: { modalMassKg: 30_000, frequencyHz: 2.0 * factor, dampingRatio: 0.005, direction: 'vertical' },
            tmds: [result.tmd],
            loadCase: spec,
            criteria: { set: 'setra', class: 'maximum' },
          }),
        );
        expect(result.detuning.loadCases[i].worstUtilisation).toBeGreaterThanOrEqual(answer.utilisation * (1 - 1e-9));
      }
    }
  });

  it('names the variant’s field when the engine refuses the combination', () => {
    const lateral = { id: 'lc-lat', name: 'lateral', spec: { kind: 'lateral' as const, guide: 'setra' as const, densityPerM2: 0.5, deckAreaM2: 100, harmonic: 1 as const } };
    try {
      computeVariantResult(input({}, [walker, lateral]));
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(ComputeInputError);
      expect((error as ComputeInputError).issues.map((i) => i.path)).toContain('modeId');
    }
  });
});

describe('computeVariantSize', () => {
  it('finds the smallest mass ratio meeting the limit at both edges of the detuning band', () => {
    const sized = computeVariantSize(input());
    expect(sized.massRatio).toBeGreaterThan(0);
    expect(sized.worstUtilisation).toBeLessThanOrEqual(1);
    for (const factor of [0.9, 1.1]) {
      const answer = designCommands.assess.run(
        designCommands.assess.request.parse({
          structure: { modalMassKg: 30_000, frequencyHz: 2.0 * factor, dampingRatio: 0.005, direction: 'vertical' },
          tmds: [sized.tmd],
          loadCase: { ...crowd.spec, modeShapeMean: 0.6 },
          criteria: { set: 'setra', class: 'maximum' },
        }),
      );
      expect(answer.utilisation).toBeLessThanOrEqual(1);
    }
    // 1 % less mass fails somewhere in the band (the answer is the smallest, to the search's 0.2 %).
    const smaller = computeVariantResult(input({ massRatio: sized.massRatio * 0.99 }));
    expect(smaller.detuning.worstUtilisation).toBeGreaterThan(1);
  });

  it('refuses a variant tuned by hand, naming tuning', () => {
    expect(() => computeVariantSize(input({ tuning: { frequencyHz: 1.95, dampingRatio: 0.07 } }))).toThrow(/tuning/);
  });
});

describe('computeVariantCurves', () => {
  it('samples the response so that its largest point is the continuous peak of assess', () => {
    const curves = computeVariantCurves(input(), 0);
    const all = curves.response.flatMap((b) => b.accelerationMPerS2);
    expect(Math.max(...all)).toBeCloseTo(curves.peak?.accelerationMPerS2 ?? NaN, 9);
    expect(curves.robustness?.peakAccelerationMPerS2.length).toBe(curves.robustness?.structureFrequencyHz.length);
  });

  it('refines where the curve bends: a narrow resonance gets points around its top', () => {
    // |H| of a lightly damped oscillator (ζ = 0.001 at 1 Hz): the half-power width is 0.002 Hz on a 0–2 Hz band.
    const h = (f: number) => [1 / Math.hypot(1 - f * f, 2 * 0.001 * f)];
    const sampled = sampleAdaptively(h, 0, 2, [], { initialPoints: 16, maxPoints: 400 });
    const near = sampled.frequencyHz.filter((f) => Math.abs(f - 1) < 0.002).length;
    expect(near).toBeGreaterThanOrEqual(3);
    expect(Math.max(...sampled.values[0])).toBeGreaterThan(0.9 * 500);
  });

  it('gives a moving walker’s time history with the peak kept', () => {
    const movingWalker = { id: 'lc-mw', name: 'one walker crossing', spec: { kind: 'moving-walker' as const, spanM: 30 } };
    const curves = computeVariantCurves(input({}, [movingWalker]), 0);
    const history = curves.timeHistory;
    expect(history).not.toBeNull();
    expect(Math.max(...(history?.structureAccelerationMPerS2 ?? []).map(Math.abs))).toBe(history?.peakAccelerationMPerS2);
  });
});

describe('published closed forms through a variant', () => {
  it('tunes Warburton’s white-noise optimum: f = √(1+μ/2)/(1+μ), ζ_a = √(μ(1+3μ/4)/(4(1+μ)(1+μ/2)))', () => {
    // Warburton, Earthquake Engineering and Structural Dynamics 10 (1982), force on an undamped primary.
    const mu = 0.04;
    const tmd = tuneVariantDamper(mode, mu, { method: 'warburton-random' });
    expect(tmd.frequencyHz).toBeCloseTo((2.0 * Math.sqrt(1 + mu / 2)) / (1 + mu), 12);
    expect(tmd.dampingRatio).toBeCloseTo(Math.sqrt((mu * (1 + (3 * mu) / 4)) / (4 * (1 + mu) * (1 + mu / 2))), 12);
  });

  it('finds the bare mode’s resonant acceleration F/(M · 2ζ√(1−ζ²)) in the stored result and on the sampled curve', () => {
    // Single-DOF acceleration response factor, maximum 1/(2ζ√(1−ζ²)): textbook structural dynamics (e.g. Chopra,
    // Dynamics of Structures, harmonic excitation; the book is cited from memory).
    const forceN = 500;
    const harmonic = { id: 'lc-h', name: 'harmonic', spec: { kind: 'harmonic' as const, modalForceAmplitudeN: forceN, pacingRangeHz: [1.5, 2.5] as [number, number] } };
    const exact = forceN / (30_000 * 2 * 0.005 * Math.sqrt(1 - 0.005 ** 2));
    const v = input({}, [harmonic]);
    const result = computeVariantResult(v);
    expect(result.loadCases[0].bareStructurePeakAccelerationMPerS2).toBeCloseTo(exact, 6);
    const curves = computeVariantCurves(v, 0);
    const sampledTop = Math.max(...curves.response[0].bareStructureAccelerationMPerS2.map((a) => a ?? 0));
    expect(sampledTop).toBeGreaterThan(0.999 * exact);
    expect(sampledTop).toBeLessThanOrEqual(exact * (1 + 1e-9));
  });

  it('widens the detuning check with a damper damping tolerance (never lower than without it)', () => {
    const without = computeVariantResult(input());
    const withTolerance = computeVariantResult(input({ tmdDampingToleranceRatio: 0.3 }));
    expect(withTolerance.detuning.worstUtilisation).toBeGreaterThanOrEqual(without.detuning.worstUtilisation);
    expect(withTolerance.detuning.tmdDampingToleranceRatio).toBe(0.3);
  });
});

describe('frequency-dependent limits', () => {
  it('checks ISO 10137 against its limit at each frequency, the same utilisation as assess', () => {
    const floorMode = { modalMassKg: 25_000, frequencyHz: 6.0, dampingRatio: 0.03, direction: 'vertical' as const };
    const v: VariantComputeInput = {
      mode: floorMode,
      loadCases: [{ id: 'lc-floor', name: 'floor walking', spec: { kind: 'floor-walking' } }],
      criteria: { spec: { set: 'iso10137', class: 'office' } },
      variant: { massRatio: 0.02, tuning: { method: 'den-hartog' }, structureFrequencyToleranceRatio: 0 },
    };
    const result = computeVariantResult(v);
    const answer = designCommands.assess.run(
      designCommands.assess.request.parse({ structure: floorMode, tmds: [result.tmd], loadCase: { kind: 'floor-walking' }, criteria: { set: 'iso10137', class: 'office' }, hardware: { unitCount: 1 } }),
    );
    expect(result.loadCases[0].utilisation).toBe(answer.utilisation);
    // With no detuning band the detuned worst is the nominal utilisation.
    expect(result.detuning.worstUtilisation).toBeCloseTo(answer.utilisation, 9);
    const curves = computeVariantCurves(v, 0);
    expect(curves.response.every((b) => b.limitMPerS2?.length === b.frequencyHz.length)).toBe(true);
  });
});
