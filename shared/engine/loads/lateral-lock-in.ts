/**
 * Lateral lock-in: the critical number of walking people above which their lateral force, proportional to the deck
 * velocity, overcomes the damping of a lateral mode (P. Dallard, A. J. Fitzpatrick, A. Flint et al., "The London
 * Millennium Footbridge", The Structural Engineer 79(22), 2001):
 *   N_L = 8 π ζ f M / k,   k ≈ 300 N s/m per person on 0.5–1.0 Hz, for a half-sine mode
 * (confirmed: J. H. G. Macdonald, Proc. R. Soc. A 465, 2009, which quotes the formula
 * and k).
 * The formula amounts to a negative modal damping of N k / 2 per mode (pedestrians spread uniformly along a half
 * sine: mean φ² = 1/2). With dampers, the same negative damping is put on the structure DOF of the coupled system
 * and N_L is the smallest N at which one of its eigenvalues crosses into the right half plane (found by bisection
 * on N with ml-matrix's non-symmetric eigenvalue decomposition of the first-order state matrix).
 */

import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { StructureMode, TmdParameters } from '../types';

/** Lateral force coefficient per pedestrian, N s/m, on 0.5–1.0 Hz (Dallard et al. 2001; confirmed via Macdonald 2009). */
export const dallardLateralCoefficientNsPerM = 300;
/** The lateral-mode frequencies that coefficient was found for, Hz (Dallard et al. 2001; confirmed via Macdonald 2009). */
export const dallardCoefficientRangeHz = [0.5, 1.0] as const;

/** N_L = 8 π ζ f M / k for the bare mode. */
export function criticalPedestriansBare(structure: StructureMode, coefficientNsPerM = dallardLateralCoefficientNsPerM): number {
  if (!(coefficientNsPerM > 0)) throw new RangeError(`lockInCoefficientNsPerM must be > 0, got ${coefficientNsPerM}`);
  return (8 * Math.PI * structure.dampingRatio * structure.frequencyHz * structure.modalMassKg) / coefficientNsPerM;
}

/** Largest real part of the eigenvalues of the coupled system with an extra modal damping `extraDampingNsPerM` on DOF 0. */
export function largestRealPart(structure: StructureMode, tmds: readonly TmdParameters[], extraDampingNsPerM: number): number {
  const n = tmds.length + 1;
  const ws = 2 * Math.PI * structure.frequencyHz;
  const mass = new Float64Array(n);
  const K = Matrix.zeros(n, n);
  const C = Matrix.zeros(n, n);
  mass[0] = structure.modalMassKg;
  K.set(0, 0, structure.modalMassKg * ws * ws);
  C.set(0, 0, 2 * structure.dampingRatio * structure.modalMassKg * ws + extraDampingNsPerM);
  tmds.forEach((t, j) => {
    const w = 2 * Math.PI * t.frequencyHz;
    const k = t.massKg * w * w;
    const c = 2 * t.dampingRatio * t.massKg * w;
    const i = j + 1;
    mass[i] = t.massKg;
    K.set(0, 0, K.get(0, 0) + k);
    K.set(i, i, k);
    K.set(0, i, -k);
    K.set(i, 0, -k);
    C.set(0, 0, C.get(0, 0) + c);
    C.set(i, i, c);
    C.set(0, i, -c);
    C.set(i, 0, -c);
  });
  // State z = [x; v]: ż = [[0, I], [−M⁻¹K, −M⁻¹C]] z
  const A = Matrix.zeros(2 * n, 2 * n);
  for (let r = 0; r < n; r++) {
    A.set(r, n + r, 1);
    for (let c = 0; c < n; c++) {
      A.set(n + r, c, -K.get(r, c) / mass[r]);
      A.set(n + r, n + c, -C.get(r, c) / mass[r]);
    }
  }
  const evd = new EigenvalueDecomposition(A);
  return Math.max(...evd.realEigenvalues);
}

/**
 * Critical number of pedestrians of the coupled system: the smallest N where the negative damping N k / 2 makes it
 * unstable. Equals `criticalPedestriansBare` when there is no damper.
 */
export function criticalPedestrians(
  structure: StructureMode,
  tmds: readonly TmdParameters[],
  coefficientNsPerM = dallardLateralCoefficientNsPerM,
): number {
  const bare = criticalPedestriansBare(structure, coefficientNsPerM);
  if (tmds.length === 0) return bare;
  // No damping anywhere: any negative damping, however small, destabilises the system.
  if (structure.dampingRatio === 0 && tmds.every((t) => t.dampingRatio === 0)) return 0;
  const unstable = (count: number) => largestRealPart(structure, tmds, -0.5 * count * coefficientNsPerM) > 0;
  let lo = 0;
  let hi = Math.max(bare, 1);
  let guard = 0;
  while (!unstable(hi)) {
    lo = hi;
    hi *= 2;
    if (++guard > 60) return Infinity;
  }
  for (let i = 0; i < 200 && hi - lo > 1e-9 * hi; i++) {
    const mid = 0.5 * (lo + hi);
    if (unstable(mid)) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}
