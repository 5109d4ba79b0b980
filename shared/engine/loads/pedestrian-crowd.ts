/**
 * Crowd loading of footbridges by the harmonic load models of two published guides, kept as two separate sets:
 *  - Sétra/AFGC, "Footbridges: assessment of vibrational behaviour of footbridges under pedestrian loading",
 *    technical guide, October 2006 (here `setra`);
 *  - HiVoSS, "Design of footbridges — Guideline", RFS2-CT-2007-00033, September 2008 (here `hivoss`).
 *
 * Both guides load the mode with an equivalent number n' of synchronised pedestrians, each with the first-harmonic
 * force amplitude P of the direction (vertical 280 N, longitudinal 140 N, lateral 35 N), reduced by a frequency
 * coefficient ψ(f) that differs between the guides. The modal force for a unit-max mode shape φ is
 *   F(f) = P · ψ(f) · n' · mean(|φ|)       (mean over the loaded deck; 2/π for a half sine),
 * with n' = 10.8 √(ζ n) below 1 person/m² and 1.85 √n from 1 person/m², n = density × deck area.
 *
 * Values and how they were checked (see docs/engine.md, "Pedestrian load cases"):
 *  - the two formulas for n' and the density classes: Sétra 2006 §2.5 / HiVoSS 2008 §4.5.1 (Sétra class III 0.5,
 *    class II 0.8 and HiVoSS TC2–TC5 0.2/0.5/1.0/1.5 P/m² seen in excerpts of the guides; Sétra class I 1.0 P/m²,
 *    HiVoSS TC1 "15 persons" and the 1.85 √n branch from memory);
 *  - per-person amplitudes 280/140/35 N: from memory of both guides;
 *  - Sétra ψ breakpoints (1.0/1.7/2.1/2.6 Hz vertical, 0.3/0.5/1.1/1.3 Hz lateral): seen in an excerpt of the guide;
 *  - HiVoSS ψ breakpoints (1.25/1.7/2.1/2.3 Hz vertical and longitudinal, 0.5/0.7/1.0/1.2 Hz lateral): from memory.
 * Only the first harmonic of the pedestrian force is modelled (each guide's second-harmonic branch is not).
 */

export type CrowdGuide = 'setra' | 'hivoss';
export type LoadDirection = 'vertical' | 'lateral' | 'longitudinal';

/** First-harmonic force amplitude of one pedestrian, N (Sétra 2006 and HiVoSS 2008; from memory). */
export const pedestrianForceAmplitudeN: Readonly<Record<LoadDirection, number>> = {
  vertical: 280,
  longitudinal: 140,
  lateral: 35,
};

/**
 * A trapezoidal reduction coefficient: 0 below `zeroBelowHz`, rising linearly to 1 at `oneFromHz`, 1 up to
 * `oneToHz`, falling linearly to 0 at `zeroAboveHz`.
 */
export interface PsiCurve {
  zeroBelowHz: number;
  oneFromHz: number;
  oneToHz: number;
  zeroAboveHz: number;
}

/** ψ(f) of each guide and direction. Longitudinal uses the vertical curve (both guides). */
export const psiCurves: Readonly<Record<CrowdGuide, Readonly<Record<LoadDirection, PsiCurve>>>> = {
  setra: {
    // Sétra 2006, figures of the reduction coefficient ψ for the first harmonic (seen in an excerpt of the guide).
    vertical: { zeroBelowHz: 1.0, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.6 },
    longitudinal: { zeroBelowHz: 1.0, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.6 },
    lateral: { zeroBelowHz: 0.3, oneFromHz: 0.5, oneToHz: 1.1, zeroAboveHz: 1.3 },
  },
  hivoss: {
    // HiVoSS 2008 guideline, reduction coefficient ψ (from memory: 1.25/1.7/2.1/2.3 Hz; lateral 0.5/0.7/1.0/1.2 Hz).
    vertical: { zeroBelowHz: 1.25, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.3 },
    longitudinal: { zeroBelowHz: 1.25, oneFromHz: 1.7, oneToHz: 2.1, zeroAboveHz: 2.3 },
    lateral: { zeroBelowHz: 0.5, oneFromHz: 0.7, oneToHz: 1.0, zeroAboveHz: 1.2 },
  },
};

/** Evaluates a trapezoidal ψ curve; exact at the breakpoints. */
export function evaluatePsi(curve: PsiCurve, frequencyHz: number): number {
  const f = frequencyHz;
  if (f <= curve.zeroBelowHz || f >= curve.zeroAboveHz) return 0;
  if (f < curve.oneFromHz) return (f - curve.zeroBelowHz) / (curve.oneFromHz - curve.zeroBelowHz);
  if (f <= curve.oneToHz) return 1;
  return (curve.zeroAboveHz - f) / (curve.zeroAboveHz - curve.oneToHz);
}

/** ψ of a guide and direction at a frequency. */
export function crowdPsi(guide: CrowdGuide, direction: LoadDirection, frequencyHz: number): number {
  if (!Number.isFinite(frequencyHz)) throw new RangeError(`frequencyHz must be finite, got ${frequencyHz}`);
  return evaluatePsi(psiCurves[guide][direction], frequencyHz);
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
  // Sétra 2006 traffic classes (class III 0.5 and class II 0.8 P/m² seen; class I 1.0 P/m² from memory).
  // Class IV (seldom used) needs no dynamic check in the guide and is not listed.
  { guide: 'setra', name: 'III', description: 'normal use, occasionally crossed by large groups', densityPerM2: 0.5 },
  { guide: 'setra', name: 'II', description: 'urban footbridge, occasionally loaded throughout its area', densityPerM2: 0.8 },
  { guide: 'setra', name: 'I', description: 'urban footbridge with very heavy traffic (dense crowd)', densityPerM2: 1.0 },
  // HiVoSS 2008 traffic classes TC1–TC5 (TC2–TC5 densities seen; TC1 "15 persons" from memory).
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
 * Equivalent number of synchronised pedestrians n' (Sétra 2006, HiVoSS 2008):
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

/** The modal force amplitude of a crowd at a forcing frequency: P ψ(f) n' mean(|φ|), N. */
export function crowdModalForceN(
  guide: CrowdGuide,
  direction: LoadDirection,
  equivalentPedestrians: number,
  modeShapeMean: number,
  frequencyHz: number,
): number {
  return pedestrianForceAmplitudeN[direction] * crowdPsi(guide, direction, frequencyHz) * equivalentPedestrians * modeShapeMean;
}
