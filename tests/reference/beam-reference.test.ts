/**
 * Lumped-mass beams converging to the handbook frequency parameters λ of uniform Euler–Bernoulli beams,
 * ω = λ² √(EI / (m L⁴)): fixed–fixed λ₁ = 4.730, cantilever λ₁ = 1.875, simply supported λ₁ = π
 * (R. D. Blevins, Formulas for Natural Frequency and Mode Shape, Van Nostrand Reinhold 1979, table of
 * straight-beam frequencies; from memory).
 * The n-DOF model: N equal beam elements (exact cubic stiffness), the beam's mass lumped at the nodes
 * (m L / N per interior node), rotations condensed out statically, then solveModes on the translational DOFs.
 */
import { describe, expect, it } from 'vitest';
import { Matrix, inverse } from 'ml-matrix';
import { solveModes } from '../../shared/engine/modal';

type Support = 'fixed-fixed' | 'cantilever' | 'simply-supported';

function lumpedBeam(support: Support, elements: number, lengthM: number, flexuralRigidityNm2: number, massPerLengthKgPerM: number) {
  const h = lengthM / elements;
  const nodes = elements + 1;
  // Global DOFs: 2 per node (w, θ).
  const size = 2 * nodes;
  const k = Matrix.zeros(size, size);
  const c = flexuralRigidityNm2 / h ** 3;
  const ke = [
    [12, 6 * h, -12, 6 * h],
    [6 * h, 4 * h * h, -6 * h, 2 * h * h],
    [-12, -6 * h, 12, -6 * h],
    [6 * h, 2 * h * h, -6 * h, 4 * h * h],
  ];
  for (let e = 0; e < elements; e++) {
    const dofs = [2 * e, 2 * e + 1, 2 * e + 2, 2 * e + 3];
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) k.set(dofs[i], dofs[j], k.get(dofs[i], dofs[j]) + c * ke[i][j]);
  }
  const restrained = new Set<number>();
  if (support === 'fixed-fixed') [0, 1, 2 * elements, 2 * elements + 1].forEach((d) => restrained.add(d));
  if (support === 'cantilever') [0, 1].forEach((d) => restrained.add(d));
  if (support === 'simply-supported') [0, 2 * elements].forEach((d) => restrained.add(d));
  const translations: number[] = [];
  const rotations: number[] = [];
  for (let node = 0; node < nodes; node++) {
    if (!restrained.has(2 * node)) translations.push(2 * node);
    if (!restrained.has(2 * node + 1)) rotations.push(2 * node + 1);
  }
  const pick = (rows: number[], cols: number[]) => new Matrix(rows.map((r) => cols.map((col) => k.get(r, col))));
  const ktt = pick(translations, translations);
  const condensed = rotations.length
    ? ktt.sub(pick(translations, rotations).mmul(inverse(pick(rotations, rotations))).mmul(pick(rotations, translations)))
    : ktt;
  const mass = translations.map((d, i) =>
    translations.map((_, j) => {
      if (i !== j) return 0;
      const node = d / 2;
      return node === 0 || node === elements ? (massPerLengthKgPerM * h) / 2 : massPerLengthKgPerM * h;
    }),
  );
  return { massKg: mass, stiffnessNPerM: condensed.to2DArray() };
}

function firstLambda(support: Support, elements: number): number {
  // An invented steel footbridge girder: L = 24 m, EI = 2.1e9 N·m², m = 1800 kg/m.
  const L = 24;
  const EI = 2.1e9;
  const m = 1800;
  const beam = lumpedBeam(support, elements, L, EI, m);
  const omega = solveModes(beam.massKg, beam.stiffnessNPerM).angularFrequencyRadPerS[0];
  return Math.sqrt(omega * Math.sqrt((m * L ** 4) / EI));
}

describe('lumped-mass beams converge to the handbook λ₁ (Blevins 1979)', () => {
  // λ₁ to full precision from the characteristic equations of the continuous beam (Blevins 1979):
  // fixed–fixed cos λ cosh λ = 1, cantilever cos λ cosh λ = −1, simply supported sin λ = 0.
  const root = (g: (x: number) => number, lo: number, hi: number) => {
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      if (Math.sign(g(mid)) === Math.sign(g(lo))) lo = mid;
      else hi = mid;
    }
    return 0.5 * (lo + hi);
  };
  const cases: [Support, number, number][] = [
    ['fixed-fixed', 4.730, root((x) => Math.cos(x) * Math.cosh(x) - 1, 4, 5)],
    ['cantilever', 1.875, root((x) => Math.cos(x) * Math.cosh(x) + 1, 1.5, 2.5)],
    ['simply-supported', 3.142, Math.PI],
  ];
  for (const [support, tabulated, precise] of cases) {
    it(`${support}: λ₁ → ${tabulated.toFixed(3)} as the DOF grow`, () => {
      const lambdas = [8, 16, 32, 64].map((elements) => firstLambda(support, elements));
      const errors = lambdas.map((lambda) => Math.abs(lambda - precise) / precise);
      for (let i = 1; i < errors.length; i++) expect(errors[i]).toBeLessThan(errors[i - 1]);
      expect(errors[3]).toBeLessThan(1e-4);
      expect(lambdas[3].toFixed(3)).toBe(tabulated.toFixed(3));
    });
  }
});
