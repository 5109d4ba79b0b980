import { describe, expect, it } from 'vitest';
import { meanSquareAmplification, peakAmplification, tuneDenHartog, tuneIoiIkeda, tuneTmd, tuneWarburtonRandom } from './tuning';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem } from './response';

describe('closed-form tunings (formulas as published; see tests/reference for the published behaviour)', () => {
  it('Den Hartog: f = 1/(1+μ), ζ_a = √(3μ/(8(1+μ))), referred to the damper frequency', () => {
    // Den Hartog, Mechanical Vibrations, 4th ed. 1956 (bibliographic details from memory).
    const { frequencyRatio, tmdDampingRatio } = tuneDenHartog(0.1);
    expect(frequencyRatio).toBeCloseTo(1 / 1.1, 15);
    expect(tmdDampingRatio).toBeCloseTo(Math.sqrt(0.3 / 8.8), 15);
    // Not the primary-frequency form √(3μ/(8(1+μ)³)), which is about 9 % lower at μ = 0.1.
    expect(tmdDampingRatio / Math.sqrt(0.3 / (8 * 1.1 ** 3))).toBeCloseTo(1.1, 12);
  });

  it('Warburton white noise and Ioi–Ikeda (which reduces to Den Hartog at ζ_s = 0)', () => {
    // Warburton, Earthquake Eng. Struct. Dyn. 10 (1982); Ioi & Ikeda, Bulletin of the JSME 21 (1978); details from memory.
    const w = tuneWarburtonRandom(0.04);
    expect(w.frequencyRatio).toBeCloseTo(Math.sqrt(1.02) / 1.04, 15);
    expect(w.tmdDampingRatio).toBeCloseTo(Math.sqrt((0.04 * 1.03) / (4 * 1.04 * 1.02)), 15);
    expect(tuneIoiIkeda(0.04, 0)).toEqual(tuneDenHartog(0.04));
    const ii = tuneIoiIkeda(0.03, 0.015);
    expect(ii.frequencyRatio).toBeCloseTo(1 / 1.03 - (0.241 + 0.051 - 0.00234) * 0.015 - (1 - 0.057 + 0.0009) * 0.015 ** 2, 14);
    expect(ii.tmdDampingRatio).toBeCloseTo(Math.sqrt(0.09 / 8.24) + (0.13 + 0.0036 + 0.00036) * 0.015 - (0.01 + 0.027 + 0.0027) * 0.015 ** 2, 14);
  });

  it('reports the damper frequency and the peak of the tuned system with its own structure damping', () => {
    const result = tuneTmd('den-hartog', 0.03, 2.2, 0.01);
    expect(result.tmdFrequencyHz).toBeCloseTo(2.2 / 1.03, 14);
    expect(result.peakAmplification).toBeCloseTo(peakAmplification(0.03, 1 / 1.03, result.tmdDampingRatio, 0.01), 12);
    expect(result.peakAmplification).toBeLessThan(peakAmplification(0.03, 1 / 1.03, result.tmdDampingRatio, 0));
  });

  it('mean-square response from the Lyapunov equation equals (1/2π)∫|X_s/F|² dω (Parseval, by quadrature)', () => {
    const mu = 0.03;
    const f = 0.97;
    const za = 0.09;
    const zs = 0.01;
    const system = createModeTmdSystem({ modalMassKg: 1, frequencyHz: 1 / (2 * Math.PI), dampingRatio: zs }, [
      { massKg: mu, frequencyHz: f / (2 * Math.PI), dampingRatio: za },
    ]);
    const point = createModeTmdPoint(system);
    // Composite Simpson on ω ∈ [0, 60] rad/s with a fine step; the tail beyond decays as ω⁻⁴.
    const steps = 600000;
    const h = 60 / steps;
    let integral = 0;
    for (let i = 0; i <= steps; i++) {
      const omega = i * h;
      const x = evaluateModeTmdSystem(system, omega / (2 * Math.PI), point).structureDisplacementMPerN;
      integral += (i === 0 || i === steps ? 1 : i % 2 ? 4 : 2) * x * x;
    }
    integral *= h / 3;
    const twoSided = (2 * integral) / (2 * Math.PI);
    expect(meanSquareAmplification(mu, f, za, zs) / twoSided).toBeCloseTo(1, 6);
  });

  it('refuses bad arguments', () => {
    expect(() => tuneTmd('den-hartog', 0, 2)).toThrow(/massRatio: must be a finite number greater than 0/);
    expect(() => tuneTmd('hinf', 0.02, 2, 1.2)).toThrow(/structureDampingRatio: must be a damping ratio in \[0, 1\)/);
    expect(() => tuneTmd('hinf', 0.02, -2)).toThrow(/structureFrequencyHz/);
    expect(() => tuneTmd('other' as never, 0.02, 2)).toThrow(/method: must be one of/);
    expect(() => tuneTmd('hinf', 0.02, 2, 0.75)).toThrow(/structureDampingRatio: must be below 1\/√2/);
    expect(() => tuneTmd('ioi-ikeda', 0.02, 2, 0.9)).toThrow(/structureDampingRatio: the Ioi–Ikeda fit gives no usable tuning/);
  });
});
