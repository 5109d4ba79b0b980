/**
 * Shared engine types. SI units throughout; the unit is in every name that carries one.
 * Every damping ratio is referred to the frequency of the oscillator it belongs to.
 */

/**
 * Directions a structure mode can move in: the one list for every command and stored mode. A torsional mode
 * (a deck twisting about its axis) is checked with the horizontal comfort limits (EN 1990 A2.4.3.2).
 */
export const modeDirections = ['vertical', 'lateral', 'longitudinal', 'torsional'] as const;
export type ModeDirection = (typeof modeDirections)[number];

/** One structural mode, modal mass for the mode shape scaled to 1 at the damper's position. */
export interface StructureMode {
  modalMassKg: number;
  frequencyHz: number;
  dampingRatio: number;
}

/** One tuned mass damper: moving mass, its own frequency, damping ratio referred to its own frequency. */
export interface TmdParameters {
  massKg: number;
  frequencyHz: number;
  dampingRatio: number;
}

/** The tuning methods, by their request names (tuning.ts; the `tune` command's `method`). */
export const tuningMethods = ['den-hartog', 'warburton-random', 'ioi-ikeda', 'hinf', 'h2'] as const;
export type TuningMethod = (typeof tuningMethods)[number];

export interface TuningResult {
  frequencyRatio: number;
  tmdFrequencyHz: number;
  tmdDampingRatio: number;
  /** max over frequency of |X_s| K / F for the tuned system (continuous peak search). */
  peakAmplification: number;
}
