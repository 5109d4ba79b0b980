import { z } from 'zod';
import { modeDirections, tuningMethods } from '../engine/types';
import { typeError } from './messages';

/**
 * The engine's shapes, one zod schema each: a structure mode, a tuned mass damper, a direction, the tuning method,
 * warnings. The compute commands (compute.ts, compute-design.ts) and whatever stores these things build on them,
 * so a saved mode is the engine's mode plus its own fields. SI units, named in every field.
 *
 * Physical ranges: a value outside them is not a structure or a damper anyone builds, and numbers that far out
 * make the arithmetic underflow or overflow (a 1e-300 kg mass, a 1e300 m displacement). Each refusal names the
 * field and the range.
 */

/** Smallest and largest mass of a mode, a damper or a DOF of a mass matrix, kg (a gram to a billion tonnes). */
export const MIN_MASS_KG = 1e-3;
export const MAX_MASS_KG = 1e12;
/** Lowest and highest natural, damper, forcing or response frequency, Hz (a 100-s sway to a 1-ms buzz). */
export const MIN_FREQUENCY_HZ = 0.01;
export const MAX_FREQUENCY_HZ = 1000;
/** Largest magnitude of an entry of a stiffness matrix, N/m: about MAX_MASS_KG × (2π MAX_FREQUENCY_HZ)². */
export const MAX_STIFFNESS_N_PER_M = 1e20;
/**
 * Largest ratio between the largest and the smallest diagonal entry of a mass matrix, and between the largest and the
 * smallest non-zero diagonal entry of a stiffness matrix: double precision carries about 16 digits, and a model whose
 * entries spread over more than 12 orders of magnitude leaves its small ones too few to give trustworthy modes.
 */
export const MAX_DIAGONAL_RATIO = 1e12;
/** Largest initial displacement of `free`, m, and largest initial velocity, m/s. */
export const MAX_DISPLACEMENT_M = 1e3;
export const MAX_VELOCITY_M_PER_S = 1e3;
/** Largest |t| of a time of `free`, s (about 11.6 days). */
export const MAX_TIME_S = 1e6;
/** Largest force amplitude, N (about a hundred thousand tonnes-force). */
export const MAX_FORCE_N = 1e9;
/** Largest total mass of the dampers on one mode against its modal mass (the `tune` command's rule for μ). */
export const MAX_MASS_RATIO = 1;
/**
 * Smallest mass ratio of a damper (its mass against the modal mass): a millionth does nothing measurable, and
 * lighter ones leave the coupled system's matrices too ill-conditioned to solve (and the numerical tunings without
 * an optimum to find).
 */
export const MIN_MASS_RATIO = 1e-6;
/** Largest weight a load case may give, N: twice the weight of the heaviest modal mass (DG11's effective weight). */
export const MAX_WEIGHT_N = 1e14;
/** Largest body weight of one person, N (about a tonne-force). */
export const MAX_BODY_WEIGHT_N = 1e4;
/** Largest walking or running speed, m/s (faster than any runner). */
export const MAX_WALKING_SPEED_M_PER_S = 15;
/** Largest crowd density, persons per m² (beyond any crowd that can stand; the guides' classes stop at 1.5). */
export const MAX_DENSITY_PER_M2 = 10;
/** Largest loaded deck area, m² (a square kilometre). */
export const MAX_DECK_AREA_M2 = 1e6;
/** Most dampers on one mode. */
export const MAX_TMDS = 50;

/** A limit as the messages write it: 0.001, 1000, 1e12, 1e-3 … */
export const formatNumber = (value: number): string => (Math.abs(value) >= 1e5 || (value !== 0 && Math.abs(value) < 1e-3) ? value.toExponential().replace('e+', 'e') : String(value));

/** "between 0.001 and 1e12 kg (a modal mass)": the range as the messages word it. */
export function rangeText(min: number, max: number, unit: string, what: string): string {
  return `between ${formatNumber(min)} and ${formatNumber(max)} ${unit} (${what})`;
}

/** A number (type message `must be a number`). */
export const numberSchema = (typeMessage = 'must be a number') => z.number({ error: typeError(typeMessage) });

/**
 * A positive number inside a physical range: "must be greater than 0" first (the sign rule), then the range.
 */
export function positiveInRange(min: number, max: number, unit: string, what: string, typeMessage?: string) {
  const range = rangeText(min, max, unit, what);
  return numberSchema(typeMessage)
    .gt(0, { error: 'must be greater than 0', abort: true })
    .min(min, { error: `must be ${range}` })
    .max(max, { error: `must be ${range}` });
}

/** A mass of a mode or a damper, kg. */
export const massKgSchema = (what: string, typeMessage?: string) => positiveInRange(MIN_MASS_KG, MAX_MASS_KG, 'kg', what, typeMessage);
/** A frequency, Hz. */
export const frequencyHzSchema = (what: string, typeMessage?: string) => positiveInRange(MIN_FREQUENCY_HZ, MAX_FREQUENCY_HZ, 'Hz', what, typeMessage);
/** A force amplitude, N. */
export const forceNSchema = (what: string, typeMessage?: string) => numberSchema(typeMessage).gt(0, { error: 'must be greater than 0', abort: true }).max(MAX_FORCE_N, { error: `must be at most ${formatNumber(MAX_FORCE_N)} N (${what})` });

/** A damping ratio in [0, 1), referred to the frequency of the oscillator it belongs to. */
export const dampingRatioSchema = (typeMessage?: string) =>
  numberSchema(typeMessage)
    .min(0, { error: 'must be a damping ratio in [0, 1): 0 or greater' })
    .lt(1, { error: 'must be a damping ratio in [0, 1): less than 1' });

/** Direction a mode moves in: vertical, lateral, longitudinal or torsional. */
export const directionSchema = z.enum(modeDirections, {
  error: typeError(`must be ${modeDirections.map((d) => `"${d}"`).join(', ').replace(/, ([^,]*)$/, ' or $1')}`),
});
export type Direction = z.infer<typeof directionSchema>;

/**
 * One structure mode: modal mass for the mode shape scaled to 1 at the damper's position, natural frequency,
 * damping ratio, direction (default vertical; the steady-state response does not depend on it, the load models and
 * comfort criteria do).
 */
export const structureModeSchema = z.strictObject(
  {
    modalMassKg: massKgSchema('a modal mass'),
    frequencyHz: frequencyHzSchema('a natural frequency'),
    /** [0, 1); 0 is refused only where a load model needs the structure's damping. */
    dampingRatio: dampingRatioSchema(),
    direction: directionSchema.default('vertical'),
  },
  { error: typeError('must be an object { modalMassKg, frequencyHz, dampingRatio, direction }') },
);
export type StructureModeInput = z.input<typeof structureModeSchema>;
export type StructureModeParsed = z.output<typeof structureModeSchema>;

/** One tuned mass damper: moving mass, own frequency, damping ratio referred to its own frequency. */
export const tmdSchema = z.strictObject(
  {
    massKg: massKgSchema('a damper mass'),
    frequencyHz: frequencyHzSchema("a damper's own frequency"),
    dampingRatio: dampingRatioSchema(),
  },
  { error: typeError('must be an object { massKg, frequencyHz, dampingRatio }') },
);
export type Tmd = z.infer<typeof tmdSchema>;

/**
 * The dampers on one mode: at most MAX_TMDS, and their total mass at most MAX_MASS_RATIO × the modal mass (checked
 * against the structure by `checkTotalMassRatio`).
 */
export const tmdListSchema = (minCount = 0) => {
  const list = z.array(tmdSchema, { error: typeError('must be an array of dampers (it may be empty)') });
  return (minCount > 0 ? list.min(minCount, { error: 'must hold one damper' }) : list).max(MAX_TMDS, { error: `must hold at most ${MAX_TMDS} dampers` });
};

/**
 * Refuses dampers heavier together than MAX_MASS_RATIO × the modal mass (naming `tmds`) and a damper lighter than
 * MIN_MASS_RATIO × the modal mass (naming its `tmds.<j>.massKg`).
 */
export function checkTotalMassRatio(
  value: { structure: { modalMassKg: number }; tmds: ReadonlyArray<{ massKg: number }> },
  ctx: z.RefinementCtx,
): void {
  value.tmds.forEach((tmd, j) => {
    if (tmd.massKg < MIN_MASS_RATIO * value.structure.modalMassKg) {
      ctx.addIssue({
        code: 'custom',
        path: ['tmds', j, 'massKg'],
        message: `must be at least ${formatNumber(MIN_MASS_RATIO)} × the modal mass, ${formatNumber(MIN_MASS_RATIO * value.structure.modalMassKg)} kg (mass ratio ≥ ${formatNumber(MIN_MASS_RATIO)}; got ${formatNumber(tmd.massKg / value.structure.modalMassKg)}): a lighter damper does nothing measurable and leaves the coupled system ill-conditioned`,
      });
    }
  });
  const total = value.tmds.reduce((sum, tmd) => sum + tmd.massKg, 0);
  const ratio = total / value.structure.modalMassKg;
  if (ratio > MAX_MASS_RATIO) {
    ctx.addIssue({
      code: 'custom',
      path: ['tmds'],
      message: `the dampers' total mass ${formatNumber(total)} kg must be at most ${MAX_MASS_RATIO} × the modal mass ${formatNumber(value.structure.modalMassKg)} kg (mass ratio ≤ ${MAX_MASS_RATIO}; got ${formatNumber(ratio)})`,
    });
  }
}

/** The tuning methods of the engine. */
export const tuningMethodSchema = z.enum(tuningMethods, { error: typeError(`must be one of ${tuningMethods.join(', ')}`) });

/** A warning of a design answer: a code and a plain sentence. */
export const designWarningSchema = z.object({ code: z.string(), message: z.string() });
export type DesignWarning = z.infer<typeof designWarningSchema>;
