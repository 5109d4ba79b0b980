/**
 * Crowd loading of footbridges by the harmonic load models of two published guides, kept as two separate sets:
 *  - Sétra/AFGC, "Footbridges: assessment of vibrational behaviour of footbridges under pedestrian loading",
 *    technical guide, October 2006 (here `setra`);
 *  - HiVoSS, "Design of footbridges — Guideline", RFS2-CT-2007-00033, September 2008 (here `hivoss`).
 *
 * Both guides load the mode with an equivalent number n' of synchronised pedestrians, each with the force amplitude
 * P of the harmonic and direction, reduced by a frequency coefficient ψ(f) that differs between the guides. The
 * modal force for a unit-max mode shape φ is
 *   F(f) = P · ψ(f) · n' · mean(|φ|)       (mean over the loaded deck; 2/π for a half sine),
 * with n' = 10.8 √(ζ n) below 1 person/m² and 1.85 √n from 1 person/m², n = density × deck area.
 *
 * First harmonic: P = 280 N vertical, 140 N longitudinal, 35 N lateral (both guides).
 * Second harmonic:
 *  - Sétra 2006, its load case 3 (traffic classes II and I only, modes in its frequency range 3, 2.6–5 Hz
 *    vertical): P = 70 N vertical, 35 N longitudinal, 7 N lateral per person, ψ = 1 on its plateau;
 *  - HiVoSS 2008: the same P = 280 / 140 N as the first harmonic with ψ's second-harmonic plateau of 0.25 on
 *    3.4–4.2 Hz (0 at 2.5 and 4.6 Hz), vertical and longitudinal; HiVoSS gives no lateral second harmonic.
 *
 * ψ between the breakpoints: straight lines (linear ramps), as the guides' figures draw them.
 *
 * Values and how sure we are of them (the PRODUCT spec's table of checked values; see docs/engine.md):
 *  - confirmed (a reproduction of Sétra's tables; research code citing HiVoSS's tables 4-6 and 4-7): the traffic
 *    classes, both formulas for n', the amplitudes 280 / 140 / 35 N and 70 / 35 / 7 N, Sétra's first-harmonic ψ
 *    breakpoints (1.0 / 1.7 / 2.1 / 2.6 Hz vertical, 0.3 / 0.5 / 1.1 / 1.3 Hz lateral), Sétra's second-harmonic
 *    range 2.6–5 Hz and its classes II and I, HiVoSS's ψ breakpoints (1.25 / 1.7 / 2.1 / 2.3 Hz vertical and the
 *    0.25 plateau on 3.4–4.2 Hz, 0 at 2.5 and 4.6 Hz; 0.5 / 0.7 / 1.0 / 1.2 Hz lateral);
 *  - read from a figure: the linear ramps of Sétra's first-harmonic ψ between its breakpoints;
 *  - NOT confirmed (from memory, assumed): the shape of Sétra's second-harmonic ψ inside 2.6–5 Hz (here 0 at 2.6,
 *    1 on 3.4–4.2, 0 at 5.0 Hz) and its lateral range (0 at 1.3, 1 on 1.7–2.1, 0 at 2.5 Hz); the use of the
 *    vertical ψ for longitudinal modes (both guides). Load cases built on them carry a warning saying so.
 */

import type { ModeDirection } from '../types';

export type CrowdGuide = 'setra' | 'hivoss';

/** The directions of a pedestrian force. */
export type ForceDirection = 'vertical' | 'lateral' | 'longitudinal';
/**
 * The direction of a structure mode (the engine's one list). A torsional mode is loaded by the vertical pedestrian force acting on the
 * vertical ordinates of its (eccentric) mode shape.
 */
export type LoadDirection = ModeDirection;
export type CrowdHarmonic = 1 | 2;

/** The pedestrian force direction that loads a mode of the given direction (torsional: vertical). */
export function forceDirectionOf(direction: LoadDirection): ForceDirection {
  return direction === 'torsional' ? 'vertical' : direction;
}

/** First-harmonic force amplitude of one pedestrian, N (Sétra 2006 and HiVoSS 2008; confirmed). */
export const pedestrianForceAmplitudeN: Readonly<Record<ForceDirection, number>> = {
  vertical: 280,
  longitudinal: 140,
  lateral: 35,
};

/** Second-harmonic force amplitude of one pedestrian, N, of Sétra 2006 load case 3 (confirmed). */
export const setraSecondHarmonicForceAmplitudeN: Readonly<Record<ForceDirection, number>> = {
  vertical: 70,
  longitudinal: 35,
  lateral: 7,
};

/**
 * A trapezoidal reduction coefficient: 0 below `zeroBelowHz`, rising linearly to `plateau` (default 1) at
 * `oneFromHz`, `plateau` up to `oneToHz`, falling linearly to 0 at `zeroAboveHz`.
 */
export interface PsiCurve {
  zeroBelowHz: number;
  oneFromHz: number;
  oneToHz: number;
  zeroAboveHz: number;
  /** Height of the flat part (HiVoSS second harmonic: 0.25); 1 when absent. */
  plateau?: number;
}

/** First-harmonic ψ(f) of each guide and force direction. Longitudinal uses the vertical curve (from memory). */
export const psiCurves: Readonly<Record<CrowdGuide, Readonly<Record<ForceDirection, PsiCurve>>>> = {
  setra: {
    // Sétra 2006, ψ for the first harmonic: breakpoints confirmed, linear ramps read from the guide's figure.
    vertical: { zeroBelowHz: 1.0, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.6 },
    longitudinal: { zeroBelowHz: 1.0, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.6 },
    lateral: { zeroBelowHz: 0.3, oneFromHz: 0.5, oneToHz: 1.1, zeroAboveHz: 1.3 },
  },
  hivoss: {
    // HiVoSS 2008, ψ for the first harmonic: 1.25 / 1.7 / 2.1 / 2.3 Hz; lateral 0.5 / 0.7 / 1.0 / 1.2 Hz (confirmed).
    vertical: { zeroBelowHz: 1.25, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.3 },
    longitudinal: { zeroBelowHz: 1.25, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.3 },
    lateral: { zeroBelowHz: 0.5, oneFromHz: 0.7, oneToHz: 1.0, zeroAboveHz: 1.2 },
  },
};

/**
 * Second-harmonic ψ(f). HiVoSS 2008: plateau 0.25 on 3.4–4.2 Hz, 0 at 2.5 and 4.6 Hz (confirmed), no lateral curve.
 * Sétra 2006 case 3: its range 2.6–5 Hz is confirmed, the trapezoid inside it (plateau 1 on 3.4–4.2 Hz) and the
 * lateral 1.3 / 1.7 / 2.1 / 2.5 Hz are from memory (assumed).
 */
export const secondHarmonicPsiCurves: Readonly<Record<CrowdGuide, Readonly<Partial<Record<ForceDirection, PsiCurve>>>>> = {
  setra: {
    vertical: { zeroBelowHz: 2.6, oneFromHz: 3.4, oneToHz: 4.2, zeroAboveHz: 5.0 },
    longitudinal: { zeroBelowHz: 2.6, oneFromHz: 3.4, oneToHz: 4.2, zeroAboveHz: 5.0 },
    lateral: { zeroBelowHz: 1.3, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.5 },
  },
  hivoss: {
    vertical: { zeroBelowHz: 2.5, oneFromHz: 3.4, oneToHz: 4.2, zeroAboveHz: 4.6, plateau: 0.25 },
    longitudinal: { zeroBelowHz: 2.5, oneFromHz: 3.4, oneToHz: 4.2, zeroAboveHz: 4.6, plateau: 0.25 },
  },
};

/** Sétra 2006 applies its second-harmonic case 3 to these traffic classes only. */
export const setraSecondHarmonicClasses = ['II', 'I'] as const;
/** The smallest density of those classes (class II), persons/m². */
export const setraSecondHarmonicMinimumDensityPerM2 = 0.8;

/** Evaluates a trapezoidal ψ curve; exact at the breakpoints. */
export function evaluatePsi(curve: PsiCurve, frequencyHz: number): number {
  const f = frequencyHz;
  const top = curve.plateau ?? 1;
  if (f <= curve.zeroBelowHz || f >= curve.zeroAboveHz) return 0;
  if (f < curve.oneFromHz) return (top * (f - curve.zeroBelowHz)) / (curve.oneFromHz - curve.zeroBelowHz);
  if (f <= curve.oneToHz) return top;
  return (top * (curve.zeroAboveHz - f)) / (curve.zeroAboveHz - curve.oneToHz);
}

/**
 * The crowd load of a guide, harmonic and mode direction: force per person and ψ curve, or undefined where the
 * guide defines none (HiVoSS lateral second harmonic).
 */
export interface CrowdHarmonicModel {
  guide: CrowdGuide;
  harmonic: CrowdHarmonic;
  forceDirection: ForceDirection;
  forcePerPersonN: number;
  psi: PsiCurve;
}

export function findCrowdHarmonicModel(
  guide: CrowdGuide,
  harmonic: CrowdHarmonic,
  direction: LoadDirection,
): CrowdHarmonicModel | undefined {
  const forceDirection = forceDirectionOf(direction);
  if (harmonic === 1) {
    return { guide, harmonic, forceDirection, forcePerPersonN: pedestrianForceAmplitudeN[forceDirection], psi: psiCurves[guide][forceDirection] };
  }
  const psi = secondHarmonicPsiCurves[guide][forceDirection];
  if (!psi) return undefined;
  const forcePerPersonN = guide === 'setra' ? setraSecondHarmonicForceAmplitudeN[forceDirection] : pedestrianForceAmplitudeN[forceDirection];
  return { guide, harmonic, forceDirection, forcePerPersonN, psi };
}

/** ψ of a guide and mode direction at a frequency (first harmonic unless `harmonic` is 2; 0 where none is defined). */
export function crowdPsi(guide: CrowdGuide, direction: LoadDirection, frequencyHz: number, harmonic: CrowdHarmonic = 1): number {
  if (!Number.isFinite(frequencyHz)) throw new RangeError(`frequencyHz must be finite, got ${frequencyHz}`);
  const model = findCrowdHarmonicModel(guide, harmonic, direction);
  return model ? evaluatePsi(model.psi, frequencyHz) : 0;
}

/** The frequencies where a curve changes slope (hints for a peak search). */
export function psiBreakpointsHz(curve: PsiCurve): number[] {
  return [curve.zeroBelowHz, curve.oneFromHz, curve.oneToHz, curve.zeroAboveHz];
}

/** Density (traffic) classes of each guide. `personCount` replaces the density where the guide gives a head count. */
export interface TrafficClass {
  guide: CrowdGuide;
  name: string;
  description: string;
  densityPerM2?: number;
  personCount?: number;
}

export const trafficClasses: readonly TrafficClass[] = [
  // Sétra 2006 traffic classes III 0.5, II 0.8, I 1.0 P/m² (confirmed).
  // Class IV (seldom used) needs no dynamic check in the guide and is not listed.
  { guide: 'setra', name: 'III', description: 'normal use, occasionally crossed by large groups', densityPerM2: 0.5 },
  { guide: 'setra', name: 'II', description: 'urban footbridge, occasionally loaded throughout its area', densityPerM2: 0.8 },
  { guide: 'setra', name: 'I', description: 'urban footbridge with very heavy traffic (dense crowd)', densityPerM2: 1.0 },
  // HiVoSS 2008 traffic classes TC1 (15 persons on the deck) and TC2–TC5 0.2 / 0.5 / 1.0 / 1.5 P/m² (confirmed).
  { guide: 'hivoss', name: 'TC1', description: 'group of about 15 pedestrians', personCount: 15 },
  { guide: 'hivoss', name: 'TC2', description: 'weak traffic', densityPerM2: 0.2 },
  { guide: 'hivoss', name: 'TC3', description: 'dense traffic', densityPerM2: 0.5 },
  { guide: 'hivoss', name: 'TC4', description: 'very dense traffic', densityPerM2: 1.0 },
  { guide: 'hivoss', name: 'TC5', description: 'exceptionally dense traffic', densityPerM2: 1.5 },
];

export function findTrafficClass(guide: CrowdGuide, name: string): TrafficClass | undefined {
  return trafficClasses.find((c) => c.guide === guide && c.name === name);
}

/**
 * Equivalent number of synchronised pedestrians n' (Sétra 2006, HiVoSS 2008; confirmed):
 * 10.8 √(ζ n) for a density below 1 person/m², 1.85 √n from 1 person/m².
 * @param pedestrianCount n = density × deck area (or the class's head count)
 * @param densityPerM2 selects the branch
 * @param dampingRatio the structure's own damping ratio ζ
 */
export function equivalentPedestrianCount(pedestrianCount: number, densityPerM2: number, dampingRatio: number): number {
  if (!(pedestrianCount >= 0) || !Number.isFinite(pedestrianCount)) {
    throw new RangeError(`pedestrianCount must be a finite number ≥ 0, got ${pedestrianCount}`);
  }
  if (!(densityPerM2 >= 0) || !Number.isFinite(densityPerM2)) {
    throw new RangeError(`densityPerM2 must be a finite number ≥ 0, got ${densityPerM2}`);
  }
  if (!(dampingRatio >= 0 && dampingRatio < 1)) throw new RangeError(`dampingRatio must be in [0, 1), got ${dampingRatio}`);
  return densityPerM2 < 1 ? 10.8 * Math.sqrt(dampingRatio * pedestrianCount) : 1.85 * Math.sqrt(pedestrianCount);
}

/** Mean of |φ| over the deck for the unit-max half sine (simply supported span): 2/π. */
export const halfSineModeShapeMean = 2 / Math.PI;

/** The modal force amplitude of a crowd at a forcing frequency: P ψ(f) n' mean(|φ|), N (first harmonic unless 2). */
export function crowdModalForceN(
  guide: CrowdGuide,
  direction: LoadDirection,
  equivalentPedestrians: number,
  modeShapeMean: number,
  frequencyHz: number,
  harmonic: CrowdHarmonic = 1,
): number {
  const model = findCrowdHarmonicModel(guide, harmonic, direction);
  if (!model) return 0;
  return model.forcePerPersonN * crowdPsi(guide, direction, frequencyHz, harmonic) * equivalentPedestrians * modeShapeMean;
}
