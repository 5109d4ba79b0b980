import { describe, expect, it } from 'vitest';
import { fitFreeDecay } from './decay';
import { decayRecord } from './test-records';

/**
 * Free decays of a single-DOF oscillator in closed form (Chopra, Dynamics of Structures, ch. 2, from memory) with
 * white measurement noise and a quiet lead-in before the impulse. Reached: f within 0.05 %, ζ within 3 %.
 */
describe('fitFreeDecay', () => {
  const cases = [
    { frequencyHz: 2, dampingRatio: 0.01, sampleRateHz: 100 },
    { frequencyHz: 1.15, dampingRatio: 0.005, sampleRateHz: 50 },
    { frequencyHz: 5.4, dampingRatio: 0.025, sampleRateHz: 200 },
    { frequencyHz: 0.8, dampingRatio: 0.012, sampleRateHz: 25 },
  ];
  it.each(cases)('finds f = $frequencyHz Hz and ζ = $dampingRatio from a noisy free decay', (oscillator) => {
    for (const seed of [1, 2, 3]) {
      // Long enough for the decay to reach the noise (8 decay times 1/(ζω)), plus the lead-in.
      const durationS = 2 + 8 / (oscillator.dampingRatio * 2 * Math.PI * oscillator.frequencyHz);
      const record = decayRecord(oscillator, durationS, seed, { initialVelocityMPerS: 0.01, noiseStd: 2e-4, quietS: 2 });
      const result = fitFreeDecay(record, oscillator.sampleRateHz, oscillator.frequencyHz * 1.01, [0.5, oscillator.sampleRateHz * 0.45]);
      expect(result.found).toBe(true);
      if (!result.found) return;
      const fit = result.fit;
      expect(Math.abs(fit.naturalFrequencyHz / oscillator.frequencyHz - 1)).toBeLessThan(5e-4);
      expect(Math.abs(fit.dampingRatio / oscillator.dampingRatio - 1)).toBeLessThan(0.03);
      // δ = 2πζ/√(1 − ζ²) of the same fit.
      expect(fit.logarithmicDecrement).toBeCloseTo((2 * Math.PI * fit.dampingRatio) / Math.sqrt(1 - fit.dampingRatio ** 2), 10);
      expect(fit.cycleCount).toBeGreaterThan(3);
      expect(fit.rSquared).toBeGreaterThan(0.99);
      // The envelope is the mode's own amplitude: at the start of the fit ≈ v₀ω e^{−σt} (ζ small).
      const omega = 2 * Math.PI * oscillator.frequencyHz;
      const expected = 0.01 * omega * Math.exp(-oscillator.dampingRatio * omega * (fit.fitStartS - 2));
      expect(fit.fittedEnvelope[0] / expected).toBeCloseTo(1, 1);
    }
  });

  it('says so when nothing decays above the noise', () => {
    const record = decayRecord({ frequencyHz: 2, dampingRatio: 0.01, sampleRateHz: 50 }, 60, 4, { initialVelocityMPerS: 0, noiseStd: 1e-3 });
    const result = fitFreeDecay(record, 50, 2, [0.5, 20]);
    if (result.found) {
      // A noise record may by chance show a "decay": it must then be short and poor, never a confident answer.
      expect(result.fit.rSquared).toBeLessThan(0.95);
    } else {
      expect(result.reason).toMatch(/no free decay/);
    }
  });
});
