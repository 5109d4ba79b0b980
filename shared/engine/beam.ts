/**
 * A structural mode derived from a uniform Euler–Bernoulli beam, for a structure with no FE model yet.
 *
 *   f_n = λ_n² / (2π L²) · √(EI / m)
 *
 * with λ_n from the support conditions: nπ for a simply supported span, the roots of cos λ cosh λ = 1 for a span
 * fixed at both ends and of cos λ cosh λ = −1 for a cantilever (solved here by bisection). The mode shape is the
 * exact one of each case, scaled to 1 at its largest |φ| (the damper sits at the antinode), so that the modal mass
 * is M = m L ∫₀¹ φ̂² dξ (mL/2 for every simply supported mode) and the crowd factor is the mean of |φ̂| over the
 * length (2/π simply supported). The integrals are taken numerically (composite Simpson's rule on a fine grid).
 *
 * Pure: no I/O. Bad input throws EngineInputError naming the field.
 */
import { EngineInputError, checkPositive } from './linalg';

export const beamSupports = ['simply-supported', 'fixed-fixed', 'cantilever'] as const;
export type BeamSupport = (typeof beamSupports)[number];

/** Highest mode number accepted (the shape functions stay accurate in double precision well beyond it). */
export const MAX_BEAM_MODE_NUMBER = 20;

export interface BeamInput {
  support: BeamSupport;
  lengthM: number;
  /** EI, N·m². */
  bendingStiffnessNM2: number;
  /** m, kg/m. */
  massPerLengthKgPerM: number;
  /** 1-based, default 1. */
  modeNumber?: number;
}

export interface BeamMode {
  /** λ_n (dimensionless). */
  eigenvalueParameter: number;
  frequencyHz: number;
  /** Modal mass for the shape scaled to 1 at its largest |φ|, kg. */
  modalMassKg: number;
  /** ∫₀¹ φ̂² dξ: the modal mass as a fraction of the beam's mass m L. */
  modalMassFraction: number;
  /** Mean of |φ̂| over the length (the shape scaled to 1 at its largest |φ|). */
  modeShapeMean: number;
}

/** λ_n of the support case: nπ, or the n-th positive root of cos λ cosh λ = ±1. */
export function beamEigenvalueParameter(support: BeamSupport, modeNumber: number): number {
  checkModeNumber(modeNumber);
  if (support === 'simply-supported') return modeNumber * Math.PI;
  // cos λ cosh λ = s ⇔ g(λ) = cos λ − s / cosh λ = 0 (well scaled for large λ). The n-th root lies within
  // 0.5 of (n + ½)π (fixed–fixed) or (n − ½)π (cantilever), where g changes sign exactly once.
  const s = support === 'fixed-fixed' ? 1 : -1;
  const centre = support === 'fixed-fixed' ? (modeNumber + 0.5) * Math.PI : (modeNumber - 0.5) * Math.PI;
  const g = (lambda: number) => Math.cos(lambda) - s / Math.cosh(lambda);
  let lo = centre - 0.5;
  let hi = centre + 0.5;
  let gLo = g(lo);
  for (let iteration = 0; iteration < 200 && hi - lo > 1e-15 * hi; iteration++) {
    const mid = 0.5 * (lo + hi);
    const gMid = g(mid);
    if (gMid === 0) return mid;
    if (Math.sign(gMid) === Math.sign(gLo)) {
      lo = mid;
      gLo = gMid;
    } else {
      hi = mid;
    }
  }
  return 0.5 * (lo + hi);
}

/**
 * The exact mode shape at ξ = x/L (not yet normalised): sin(λξ) simply supported, otherwise
 * cosh λξ − cos λξ − σ (sinh λξ − sin λξ), written so that the large cosh and sinh terms do not cancel:
 * cosh a − σ sinh a = ((1 − σ) eᵃ + (1 + σ) e⁻ᵃ) / 2, with 1 − σ formed without subtraction of large numbers.
 */
export function beamShapeFunction(support: BeamSupport, lambda: number): (xi: number) => number {
  if (support === 'simply-supported') return (xi) => Math.sin(lambda * xi);
  const eMinus = Math.exp(-lambda);
  const sinL = Math.sin(lambda);
  const cosL = Math.cos(lambda);
  const sinhL = Math.sinh(lambda);
  const coshL = Math.cosh(lambda);
  // fixed–fixed: σ = (cosh λ − cos λ)/(sinh λ − sin λ); cantilever: σ = (cosh λ + cos λ)/(sinh λ + sin λ).
  // cosh λ − sinh λ = e^−λ, so 1 − σ = (−e^−λ ∓ sin λ ± cos λ)/(sinh λ ∓ sin λ).
  const denominator = support === 'fixed-fixed' ? sinhL - sinL : sinhL + sinL;
  const sigma = support === 'fixed-fixed' ? (coshL - cosL) / denominator : (coshL + cosL) / denominator;
  const oneMinusSigmaNumerator = support === 'fixed-fixed' ? -eMinus - sinL + cosL : -eMinus + sinL - cosL;
  return (xi) => {
    const a = lambda * xi;
    const growing = (oneMinusSigmaNumerator * Math.exp(a)) / denominator;
    return 0.5 * (growing + (1 + sigma) * Math.exp(-a)) - Math.cos(a) + sigma * Math.sin(a);
  };
}

/** Derives frequency, modal mass and mean |φ| of one beam mode; throws EngineInputError naming a bad field. */
export function deriveBeamMode(input: BeamInput): BeamMode {
  if (!(beamSupports as readonly string[]).includes(input.support)) {
    throw new EngineInputError('support', `support: must be one of ${beamSupports.join(', ')} (got ${String(input.support)})`);
  }
  checkPositive(input.lengthM, 'lengthM');
  checkPositive(input.bendingStiffnessNM2, 'bendingStiffnessNM2');
  checkPositive(input.massPerLengthKgPerM, 'massPerLengthKgPerM');
  const modeNumber = input.modeNumber ?? 1;
  const lambda = beamEigenvalueParameter(input.support, modeNumber);
  const { lengthM, bendingStiffnessNM2, massPerLengthKgPerM } = input;
  const frequencyHz = ((lambda * lambda) / (2 * Math.PI * lengthM * lengthM)) * Math.sqrt(bendingStiffnessNM2 / massPerLengthKgPerM);
  const { squareIntegral, absIntegral } = normalisedShapeIntegrals(input.support, lambda, modeNumber);
  return {
    eigenvalueParameter: lambda,
    frequencyHz,
    modalMassKg: massPerLengthKgPerM * lengthM * squareIntegral,
    modalMassFraction: squareIntegral,
    modeShapeMean: absIntegral,
  };
}

function checkModeNumber(modeNumber: number): void {
  if (typeof modeNumber !== 'number' || !Number.isInteger(modeNumber) || modeNumber < 1 || modeNumber > MAX_BEAM_MODE_NUMBER) {
    throw new EngineInputError('modeNumber', `modeNumber: must be a whole number from 1 to ${MAX_BEAM_MODE_NUMBER} (got ${modeNumber})`);
  }
}

/** ∫₀¹ φ̂² dξ and ∫₀¹ |φ̂| dξ for the shape scaled to max |φ| = 1 (Simpson's rule, peak refined by a parabola). */
function normalisedShapeIntegrals(support: BeamSupport, lambda: number, modeNumber: number) {
  const shape = beamShapeFunction(support, lambda);
  const intervals = 2 * (4000 + 1000 * modeNumber); // even; about 1000 points per half-wave or more
  const h = 1 / intervals;
  const values = new Float64Array(intervals + 1);
  let peakIndex = 0;
  for (let i = 0; i <= intervals; i++) {
    values[i] = shape(i * h);
    if (Math.abs(values[i]) > Math.abs(values[peakIndex])) peakIndex = i;
  }
  let peak = Math.abs(values[peakIndex]);
  if (peakIndex > 0 && peakIndex < intervals) {
    // The largest |φ| between grid points: vertex of the parabola through the three points around the grid's peak.
    const a = Math.abs(values[peakIndex - 1]);
    const b = peak;
    const c = Math.abs(values[peakIndex + 1]);
    const curvature = a - 2 * b + c;
    if (curvature < 0) {
      const offset = (0.5 * (a - c)) / curvature;
      const xi = (peakIndex + offset) * h;
      peak = Math.max(peak, Math.abs(shape(xi)));
    }
  }
  let square = 0;
  let abs = 0;
  for (let i = 0; i <= intervals; i++) {
    const weight = i === 0 || i === intervals ? 1 : i % 2 === 1 ? 4 : 2;
    const v = values[i] / peak;
    square += weight * v * v;
    abs += weight * Math.abs(v);
  }
  return { squareIntegral: (square * h) / 3, absIntegral: (abs * h) / 3 };
}
