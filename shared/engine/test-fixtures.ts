/** Fixtures for the engine's tests: a seeded generator and random symmetric test matrices (no clock, no Math.random). */

/** Mulberry32: a small seeded 32-bit generator, uniform on [0, 1). */
export function seededRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A random symmetric positive definite n×n matrix (B Bᵀ + n·scale·I). */
export function randomSpdMatrix(n: number, random: () => number, scale = 1): number[][] {
  const b = Array.from({ length: n }, () => Array.from({ length: n }, () => (random() - 0.5) * scale));
  return Array.from({ length: n }, (_, i) =>
    Array.from({ length: n }, (_, j) => {
      let s = 0;
      for (let k = 0; k < n; k++) s += b[i][k] * b[j][k];
      return s + (i === j ? n * scale * scale * 0.1 : 0);
    }),
  );
}

/** A chain of n masses on springs, fixed at the first end (tridiagonal K), masses and stiffnesses random. */
export function randomChain(n: number, random: () => number, fixed = true): { massKg: number[][]; stiffnessNPerM: number[][] } {
  const masses = Array.from({ length: n }, () => 100 + 900 * random());
  const springs = Array.from({ length: n }, () => 1e4 + 9e4 * random());
  const massKg = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? masses[i] : 0)));
  const stiffnessNPerM = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    // spring i connects DOF i−1 (or the ground, when fixed) to DOF i
    if (i > 0) {
      stiffnessNPerM[i - 1][i - 1] += springs[i];
      stiffnessNPerM[i - 1][i] -= springs[i];
      stiffnessNPerM[i][i - 1] -= springs[i];
      stiffnessNPerM[i][i] += springs[i];
    } else if (fixed) {
      stiffnessNPerM[0][0] += springs[0];
    }
  }
  return { massKg, stiffnessNPerM };
}

export function relativeError(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.max(Math.abs(expected), 1e-300);
}
