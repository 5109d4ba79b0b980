/**
 * Walking on floors: the resonant walking criterion of AISC Steel Design Guide 11, "Vibrations of Steel-Framed
 * Structural Systems Due to Human Activity" (Murray, Allen, Ungar, Davis; 2nd ed. 2016), §2.2 and chapter 4:
 *   a_p / g = P0 · exp(−0.35 f_n) / (β W)
 * for floors with f_n up to about 9 Hz. Confirmed (the PRODUCT spec's table: engineering scripts and a damping
 * table citing the guide): the formula, P0 = 0.29 kN for floors and 0.41 kN for footbridges, f_n ≲ 9 Hz.
 * The formula is the steady resonant response of the mode to the harmonic force P0 exp(−0.35 f) with the effective
 * panel weight W = 2 g M (W/g is twice the modal mass of a unit-max half-sine panel), which is how the coupled
 * structure + damper system is loaded here: the force amplitude P0 exp(−0.35 f) at every force frequency f of the
 * walking harmonics, i × (1.6 … 2.2 Hz) for i = 1…4.
 * NOT confirmed (from memory): that step band 1.6–2.2 Hz with four harmonics, and the 3 Hz lower bound of the
 * floors the criterion covers; a floor-walking load case carries a warning saying so.
 */

export const standardGravityMPerS2 = 9.80665;

/** DG11 constant force P0, N: floors 0.29 kN, footbridges 0.41 kN (confirmed). */
export const dg11ConstantForceN = { floor: 290, footbridge: 410 } as const;

/** DG11 step-frequency range and the number of walking harmonics it considers (from memory, not confirmed). */
export const dg11StepFrequencyRangeHz = [1.6, 2.2] as const;
export const dg11HarmonicCount = 4;
/** Upper limit of the low-frequency floor criterion, Hz (DG11 §4.1, confirmed). */
export const dg11MaximumFrequencyHz = 9;
/** Lower end of the floor frequencies the walking load model is used for, Hz (from memory, not confirmed). */
export const dg11MinimumFrequencyHz = 3;

/** The equivalent harmonic force amplitude P0 e^(−0.35 f), N, at force frequency f. */
export function dg11ForceAmplitudeN(constantForceN: number, frequencyHz: number): number {
  return constantForceN * Math.exp(-0.35 * frequencyHz);
}

/** a_p / g = P0 e^(−0.35 f_n) / (β W) (DG11 Eq. 2-2 simplified), returned as a_p in m/s². */
export function dg11PeakAccelerationMPerS2(
  constantForceN: number,
  naturalFrequencyHz: number,
  dampingRatio: number,
  effectiveWeightN: number,
): number {
  if (!(constantForceN > 0)) throw new RangeError(`constantForceN must be > 0, got ${constantForceN}`);
  if (!(naturalFrequencyHz > 0)) throw new RangeError(`naturalFrequencyHz must be > 0, got ${naturalFrequencyHz}`);
  if (!(dampingRatio > 0 && dampingRatio < 1)) throw new RangeError(`dampingRatio must be in (0, 1), got ${dampingRatio}`);
  if (!(effectiveWeightN > 0)) throw new RangeError(`effectiveWeightN must be > 0, got ${effectiveWeightN}`);
  return (standardGravityMPerS2 * dg11ForceAmplitudeN(constantForceN, naturalFrequencyHz)) / (dampingRatio * effectiveWeightN);
}

/** The force-frequency bands of the DG11 walking harmonics. */
export function dg11ForceBandsHz(
  stepRangeHz: readonly [number, number] = dg11StepFrequencyRangeHz,
  harmonicCount = dg11HarmonicCount,
): Array<[number, number]> {
  const bands: Array<[number, number]> = [];
  for (let i = 1; i <= harmonicCount; i++) bands.push([i * stepRangeHz[0], i * stepRangeHz[1]]);
  return bands;
}
