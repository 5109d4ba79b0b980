import { describe, expect, it } from 'vitest';
import { solveModes } from '../../../shared/engine/modal';
import { HttpError } from '../../lib/http-error';
import { NODE_TOLERANCE, deriveFromLumpedModel, derivedNumbersProblem, solveLumpedModel } from './lumped-model-modes';

// Two equal masses m on springs k (ground–mass–mass), a textbook 2-DOF chain: ω² = (3 ∓ √5)/2 · k/m, and the
// mass-normalised shapes follow from (K − ω² M) φ = 0 with φᵀ M φ = 1.
const m = 1000;
const k = 1e6;
const massKg = [
  [m, 0],
  [0, m],
];
const stiffnessNPerM = [
  [2 * k, -k],
  [-k, k],
];

describe('deriveFromLumpedModel', () => {
  it('gives the mode’s frequency and 1/φ² at the DOF for the mass-normalised shape (closed form of the 2-DOF chain)', () => {
    const solution = solveModes(massKg, stiffnessNPerM);
    for (const [r, sign] of [
      [0, -1],
      [1, 1],
    ] as const) {
      const omega2 = ((3 + sign * Math.sqrt(5)) / 2) * (k / m);
      // Shape (1, 2 − ω² m/k) from the first row, scaled so that m(φ1² + φ2²) = 1.
      const ratio = 2 - (omega2 * m) / k;
      const phi1 = 1 / Math.sqrt(m * (1 + ratio * ratio));
      for (const dofIndex of [0, 1]) {
        const derived = deriveFromLumpedModel(solution, r + 1, dofIndex);
        if (!derived.ok) throw new Error(derived.message);
        expect(derived.frequencyHz).toBeCloseTo(Math.sqrt(omega2) / (2 * Math.PI), 12);
        const phiD = dofIndex === 0 ? phi1 : phi1 * ratio;
        expect(derived.modalMassKg / (1 / (phiD * phiD)) - 1).toBeCloseTo(0, 12);
      }
    }
  });

  it('refuses a mode number or DOF the model lacks, a rigid-body mode and a node, naming the field', () => {
    const solution = solveModes(massKg, stiffnessNPerM);
    expect(deriveFromLumpedModel(solution, 3, 0)).toMatchObject({ ok: false, field: 'modeNumber' });
    expect(deriveFromLumpedModel(solution, 1, 2)).toMatchObject({ ok: false, field: 'dofIndex' });
    const free = solveModes(massKg, [
      [k, -k],
      [-k, k],
    ]);
    expect(deriveFromLumpedModel(free, 1, 0)).toMatchObject({ ok: false, field: 'modeNumber' });
    // Equal masses on a symmetric chain: the second mode's middle DOF is a node (textbook symmetry).
    const chain = solveModes(
      [
        [m, 0, 0],
        [0, m, 0],
        [0, 0, m],
      ],
      [
        [2 * k, -k, 0],
        [-k, 2 * k, -k],
        [0, -k, 2 * k],
      ],
    );
    expect(Math.abs(chain.shapes[1][1])).toBeLessThanOrEqual(NODE_TOLERANCE * Math.max(...chain.shapes[1].map(Math.abs)));
    expect(deriveFromLumpedModel(chain, 2, 1)).toMatchObject({ ok: false, field: 'dofIndex' });
    expect(deriveFromLumpedModel(chain, 2, 0).ok).toBe(true);
  });
});

describe('derivedNumbersProblem', () => {
  it('names a frequency or modal mass outside the engine’s ranges for a mode', () => {
    expect(derivedNumbersProblem(2, 1e4)).toBeNull();
    expect(derivedNumbersProblem(5000, 1e4)?.field).toBe('frequencyHz');
    expect(derivedNumbersProblem(2, 1e15)?.field).toBe('modalMassKg');
  });
});

describe('solveLumpedModel', () => {
  it('refuses a mass matrix that is not positive definite as 400 naming massMatrixKg', () => {
    let error: unknown;
    try {
      solveLumpedModel(
        [
          [1, 2],
          [2, 1],
        ],
        stiffnessNPerM,
        null,
      );
    } catch (caught) {
      error = caught;
    }
    expect(error).toBeInstanceOf(HttpError);
    expect((error as HttpError).status).toBe(400);
    expect((error as HttpError).details.map((issue) => issue.path)).toEqual(['massMatrixKg']);
  });

  it('refuses DOF labels that do not match the size, naming dofLabels', () => {
    expect(() => solveLumpedModel(massKg, stiffnessNPerM, ['one'])).toThrow(/dofLabels/);
  });
});
