import { describe, expect, it } from 'vitest';
import { MAX_BEAM_MODE_NUMBER, beamEigenvalueParameter, beamShapeFunction, deriveBeamMode } from './beam';
import { EngineInputError } from './linalg';

// λ_n of uniform beams: R. D. Blevins, Formulas for Natural Frequency and Mode Shape (table of beam frequencies),
// values quoted from memory to the digits given.
const blevins = {
  'fixed-fixed': [4.73004074, 7.85320462, 10.9956078, 14.1371655],
  cantilever: [1.87510407, 4.69409113, 7.85475744, 10.9955407],
} as const;

describe('beamEigenvalueParameter', () => {
  it('matches Blevins for fixed–fixed and cantilever beams, modes 1–4 (from memory)', () => {
    for (const support of ['fixed-fixed', 'cantilever'] as const) {
      blevins[support].forEach((lambda, i) => {
        expect(beamEigenvalueParameter(support, i + 1)).toBeCloseTo(lambda, 6);
      });
    }
  });

  it('solves the characteristic equations cos λ cosh λ = 1 (fixed–fixed) and −1 (cantilever) for every mode number', () => {
    for (let n = 1; n <= MAX_BEAM_MODE_NUMBER; n++) {
      const ff = beamEigenvalueParameter('fixed-fixed', n);
      const cl = beamEigenvalueParameter('cantilever', n);
      // Relative to cosh λ, the residual is the rounding of cos λ.
      expect(Math.abs(Math.cos(ff) * Math.cosh(ff) - 1) / Math.cosh(ff)).toBeLessThan(1e-13);
      expect(Math.abs(Math.cos(cl) * Math.cosh(cl) + 1) / Math.cosh(cl)).toBeLessThan(1e-13);
      // Roots ascend, one per mode: λ_n → (n + ½)π and (n − ½)π (Blevins, from memory).
      expect(Math.abs(ff - (n + 0.5) * Math.PI)).toBeLessThan(0.02);
      expect(Math.abs(cl - (n - 0.5) * Math.PI)).toBeLessThan(0.31);
      if (n > 1) {
        expect(ff).toBeGreaterThan(beamEigenvalueParameter('fixed-fixed', n - 1) + 3);
        expect(cl).toBeGreaterThan(beamEigenvalueParameter('cantilever', n - 1) + 2.5);
      }
    }
  });

  it('is nπ for a simply supported beam', () => {
    expect(beamEigenvalueParameter('simply-supported', 3)).toBe(3 * Math.PI);
  });
});

describe('beamShapeFunction', () => {
  it('meets the boundary conditions of each support (φ and φ′ at a fixed end; φ″ and φ‴ at a free end)', () => {
    const h = 1e-3;
    for (let n = 1; n <= 8; n++) {
      const ff = beamShapeFunction('fixed-fixed', beamEigenvalueParameter('fixed-fixed', n));
      const cl = beamShapeFunction('cantilever', beamEigenvalueParameter('cantilever', n));
      for (const [phi, end] of [
        [ff, 0],
        [ff, 1],
        [cl, 0],
      ] as const) {
        expect(Math.abs(phi(end))).toBeLessThan(1e-9);
        const slope = (phi(end + h) - phi(end - h)) / (2 * h);
        expect(Math.abs(slope)).toBeLessThan(1e-4 * n * n);
      }
      // Free tip of the cantilever: zero moment and shear, by central differences on the extended function.
      const second = (cl(1 + h) - 2 * cl(1) + cl(1 - h)) / (h * h);
      const lambda = beamEigenvalueParameter('cantilever', n);
      expect(Math.abs(second) / (lambda * lambda)).toBeLessThan(1e-4);
    }
  });
});

describe('deriveBeamMode', () => {
  const beam = { lengthM: 30, bendingStiffnessNM2: 2.0e9, massPerLengthKgPerM: 1500 };
  const root = Math.sqrt(beam.bendingStiffnessNM2 / beam.massPerLengthKgPerM);

  it('simply supported: f_n = n²π/(2L²)·√(EI/m), modal mass mL/2, mean |φ| = 2/π (sine mode, handbook formula)', () => {
    for (let n = 1; n <= 5; n++) {
      const mode = deriveBeamMode({ support: 'simply-supported', ...beam, modeNumber: n });
      expect(mode.frequencyHz).toBeCloseTo(((n * n * Math.PI) / (2 * beam.lengthM ** 2)) * root, 12);
      expect(mode.modalMassKg / (beam.massPerLengthKgPerM * beam.lengthM)).toBeCloseTo(0.5, 9);
      // Every half-wave of |sin| has mean 2/π, so every mode does.
      expect(mode.modeShapeMean).toBeCloseTo(2 / Math.PI, 6);
    }
  });

  it('fixed–fixed mode 1: λ = 4.730 and modal mass 0.3965 mL (Blevins: max |φ| = 1.5882 at midspan with ∫φ² = 1, from memory)', () => {
    const mode = deriveBeamMode({ support: 'fixed-fixed', ...beam });
    expect(mode.frequencyHz).toBeCloseTo(((4.73004074 ** 2) / (2 * Math.PI * beam.lengthM ** 2)) * root, 5);
    expect(mode.modalMassFraction).toBeCloseTo(1 / 1.58815 ** 2, 4);
    expect(mode.modalMassFraction).toBeCloseTo(0.3965, 3);
  });

  it('cantilever: modal mass 0.25 mL for every mode (tip |φ| = 2 with ∫φ² = 1, Blevins, from memory)', () => {
    for (let n = 1; n <= 6; n++) {
      const mode = deriveBeamMode({ support: 'cantilever', ...beam, modeNumber: n });
      expect(mode.modalMassFraction).toBeCloseTo(0.25, 6);
    }
    const first = deriveBeamMode({ support: 'cantilever', ...beam });
    expect(first.frequencyHz).toBeCloseTo(((1.87510407 ** 2) / (2 * Math.PI * beam.lengthM ** 2)) * root, 6);
  });

  it('fixed–fixed: ∫φ² = 1 for the classical normalisation, so the modal mass fraction is 1 / max φ² (modes 1–8)', () => {
    for (let n = 1; n <= 8; n++) {
      const lambda = beamEigenvalueParameter('fixed-fixed', n);
      const phi = beamShapeFunction('fixed-fixed', lambda);
      let peak = 0;
      for (let i = 0; i <= 200_000; i++) peak = Math.max(peak, Math.abs(phi(i / 200_000)));
      const mode = deriveBeamMode({ support: 'fixed-fixed', ...beam, modeNumber: n });
      expect(mode.modalMassFraction).toBeCloseTo(1 / (peak * peak), 6);
    }
  });

  it('mean |φ| of the first fixed–fixed and cantilever modes equals the closed-form integral of the shape', () => {
    // ∫₀¹ (cosh λξ − cos λξ − σ(sinh λξ − sin λξ)) dξ = (sinh λ − sin λ − σ(cosh λ + cos λ − 2)) / λ (calculus); the
    // first modes do not change sign, so this is the mean of |φ| before scaling by the peak (midspan / tip).
    for (const [support, peakAt] of [
      ['fixed-fixed', 0.5],
      ['cantilever', 1],
    ] as const) {
      const lambda = beamEigenvalueParameter(support, 1);
      const sigma =
        support === 'fixed-fixed'
          ? (Math.cosh(lambda) - Math.cos(lambda)) / (Math.sinh(lambda) - Math.sin(lambda))
          : (Math.cosh(lambda) + Math.cos(lambda)) / (Math.sinh(lambda) + Math.sin(lambda));
      const direct = (x: number) => Math.cosh(lambda * x) - Math.cos(lambda * x) - sigma * (Math.sinh(lambda * x) - Math.sin(lambda * x));
      const integral = (Math.sinh(lambda) - Math.sin(lambda) - sigma * (Math.cosh(lambda) + Math.cos(lambda) - 2)) / lambda;
      const mode = deriveBeamMode({ support, ...beam });
      expect(mode.modeShapeMean).toBeCloseTo(integral / Math.abs(direct(peakAt)), 7);
    }
  });

  it('refuses bad input naming the field', () => {
    const bad = (input: Parameters<typeof deriveBeamMode>[0], field: string) => {
      let error: unknown;
      try {
        deriveBeamMode(input);
      } catch (caught) {
        error = caught;
      }
      expect(error).toBeInstanceOf(EngineInputError);
      expect((error as EngineInputError).field).toBe(field);
    };
    bad({ support: 'simply-supported', ...beam, lengthM: 0 }, 'lengthM');
    bad({ support: 'simply-supported', ...beam, bendingStiffnessNM2: Number.NaN }, 'bendingStiffnessNM2');
    bad({ support: 'simply-supported', ...beam, massPerLengthKgPerM: -1 }, 'massPerLengthKgPerM');
    bad({ support: 'fixed-fixed', ...beam, modeNumber: 1.5 }, 'modeNumber');
    bad({ support: 'cantilever', ...beam, modeNumber: MAX_BEAM_MODE_NUMBER + 1 }, 'modeNumber');
    bad({ support: 'pinned' as 'cantilever', ...beam }, 'support');
  });
});
