import { describe, expect, it } from 'vitest';
import { AccelerationEnvelopeKernel } from './acceleration-envelope';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem } from './response';
import type { ForceBand } from './loads/response-envelope';

// Invented structure and dampers (not from any project).
const structure = { modalMassKg: 52000, frequencyHz: 1.93, dampingRatio: 0.005 };
const oneTmd = [{ massKg: 1250, frequencyHz: 1.87, dampingRatio: 0.08 }];
const threeTmds = [
  { massKg: 500, frequencyHz: 1.84, dampingRatio: 0.06 },
  { massKg: 420, frequencyHz: 1.91, dampingRatio: 0.05 },
  { massKg: 300, frequencyHz: 2.02, dampingRatio: 0.0 },
];
// A trapezoidal force over 1.25–2.3 Hz (the shape of the HiVoSS 2008 vertical ψ; the amplitude is invented) and a
// flat second band.
const trapezoid = (f: number) => 850 * Math.max(0, Math.min(1, (f - 1.25) / 0.45, (2.3 - f) / 0.2));
const bands: ForceBand[] = [
  { loHz: 1.25, hiHz: 2.3, forceN: trapezoid, kinksHz: [1.7, 2.1], label: 'trapezoid' },
  { loHz: 3.4, hiHz: 4.2, forceN: () => 120, label: 'flat' },
];

/** Brute force: the largest of 400,001 samples of each band, with the engine's receptance (response.ts). */
function denseMaximum(tmds: typeof oneTmd, dampingScale: number): number {
  const system = createModeTmdSystem(structure, tmds.map((t) => ({ ...t, dampingRatio: t.dampingRatio * dampingScale })));
  const point = createModeTmdPoint(system);
  let best = 0;
  for (const band of bands) {
    for (let k = 0; k <= 400_000; k++) {
      const f = band.loHz + ((band.hiHz - band.loHz) * k) / 400_000;
      best = Math.max(best, evaluateModeTmdSystem(system, f, point).structureAccelerationMPerS2PerN * band.forceN(f));
    }
  }
  return best;
}

describe('acceleration envelope kernel', () => {
  for (const [label, tmds] of [['one damper (closed form)', oneTmd], ['three dampers (general loop)', threeTmds]] as const) {
    it(`${label}: the continuous peak is never below a 400,001-point sweep and at most 1e-6 above it`, () => {
      const kernel = new AccelerationEnvelopeKernel(bands, tmds.length);
      kernel.setSystem(createModeTmdSystem(structure, tmds));
      for (const scale of [0.2, 1, 3]) {
        const dense = denseMaximum(tmds, scale);
        const peak = kernel.peak(scale).value;
        expect(peak).toBeGreaterThanOrEqual(dense * (1 - 1e-12));
        expect(peak / dense - 1).toBeLessThan(1e-6);
      }
    });
  }

  it('a sharp single-DOF resonance on a grid point reaches the closed-form height F / (2 ζ M √(1 − ζ²))', () => {
    // Closed form of the single-DOF acceleration receptance r² / (M |1 − r² + 2iζr|), largest at r = 1/√(1 − 2ζ²)
    // (textbook result; the engine's docs list it with its displacement twin). 1.9 Hz is a uniform grid point of the
    // 1.0–2.6 Hz band (1.0 + 27 × 1.6/48) and also the hint at the structure's frequency. (The same case through
    // `assess` is tests/reference/loads-crowd-guides.test.ts.)
    const mode = { modalMassKg: 60000, frequencyHz: 1.9, dampingRatio: 0.006 };
    // The force: 500 N times a trapezoid 0 / 1 / 1 / 0 at 1.0 / 1.7 / 2.1 / 2.6 Hz (the Sétra 2006 vertical ψ shape).
    const psi = (f: number) => Math.max(0, Math.min(1, (f - 1.0) / 0.7, (2.6 - f) / 0.5));
    const band: ForceBand[] = [{ loHz: 1.0, hiHz: 2.6, forceN: (f) => 500 * psi(f), kinksHz: [1.7, 2.1], label: 'ψ' }];
    const kernel = new AccelerationEnvelopeKernel(band, 0);
    kernel.setSystem(createModeTmdSystem(mode, []));
    const closed = 500 / (2 * 0.006 * Math.sqrt(1 - 0.006 ** 2) * 60000);
    expect(kernel.peak().value / closed).toBeCloseTo(1, 12);
  });

  it('a row of scales at once gives each scale its own peak', () => {
    const kernel = new AccelerationEnvelopeKernel(bands, 1);
    kernel.setSystem(createModeTmdSystem(structure, oneTmd));
    const scales = [0, 0.5, 1, 1.5, 2.5];
    const row = new Float64Array(scales.length);
    kernel.peaks(scales, row);
    scales.forEach((scale, k) => expect(row[k]).toBe(kernel.peak(scale).value));
  });
});
