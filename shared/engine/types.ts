/**
 * Shared engine types. SI units throughout; the unit is in every name that carries one.
 * Every damping ratio is referred to the frequency of the oscillator it belongs to. The shapes that requests and
 * answers carry are typed from their zod schemas (shared/contracts/compute-shapes.ts, compute.ts), not copied.
 */
import type { StructureModeParsed, Tmd } from '../contracts/compute-shapes';
import type { TuneResponse } from '../contracts/compute';

/**
 * Directions a structure mode can move in: the one list for every command and stored mode. A torsional mode (a deck
 * twisting about its axis) is loaded by the vertical pedestrian force on its eccentric mode shape; EN 1990 A2.4.3.2
 * checks it below 2.5 Hz with the horizontal limits (criteria.ts says which sets give a limit for it).
 */
export const modeDirections = ['vertical', 'lateral', 'longitudinal', 'torsional'] as const;
export type ModeDirection = (typeof modeDirections)[number];

/**
 * One structural mode, modal mass for the mode shape scaled to 1 at the damper's position: the contract's mode
 * without its direction (the steady-state response does not depend on it).
 */
export type StructureMode = Omit<StructureModeParsed, 'direction'>;

/** One tuned mass damper: moving mass, its own frequency, damping ratio referred to its own frequency. */
export type TmdParameters = Tmd;

/** The tuning methods, by their request names (tuning.ts; the `tune` command's `method`). */
export const tuningMethods = ['den-hartog', 'warburton-random', 'ioi-ikeda', 'hinf', 'h2'] as const;
export type TuningMethod = (typeof tuningMethods)[number];

/**
 * A tuning: frequency ratio, the damper's frequency and damping ratio, and `peakAmplification`, the max over frequency
 * of |X_s| K / F for the tuned system (continuous peak search): the `tune` command's answer.
 */
export type TuningResult = TuneResponse;
