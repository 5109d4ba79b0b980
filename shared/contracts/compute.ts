import { z } from 'zod';
import { SYMMETRY_TOLERANCE } from '../engine/linalg';
import { typeError } from './messages';
import {
  MAX_DIAGONAL_RATIO,
  MAX_DISPLACEMENT_M,
  MAX_MASS_KG,
  MAX_STIFFNESS_N_PER_M,
  MAX_TIME_S,
  MAX_VELOCITY_M_PER_S,
  MIN_MASS_KG,
  MIN_MASS_RATIO,
  checkTotalMassRatio,
  formatNumber,
  frequencyHzSchema,
  rangeText,
  structureModeSchema,
  tmdListSchema,
  tuningMethodSchema,
  forceNSchema,
} from './compute-shapes';

/** The engine's shapes (mode, damper, direction, tuning method, physical ranges), re-exported for the commands' users. */
export * from './compute-shapes';

/**
 * Requests and answers of the engine's compute commands (`modes`, `tune`, `response`, `free`), the same for the
 * `calc` command and POST /api/compute/<command>. SI units, named in every field.
 */

/** Largest matrix accepted by `modes` and `free`. */
export const MAX_DOF = 400;
/** Largest number of frequencies in one `response` request, and of times in one `free` request. */
export const MAX_POINTS = 100_000;
/** Largest times × DOF² of one `free` request (the cost of the modal sum). */
export const MAX_FREE_WORK = 200_000_000;
/** Largest times × DOF of one `free` request (the number of values in the answer). */
export const MAX_FREE_VALUES = 1_000_000;
/**
 * Largest frequencies × dampers of one `response` request (each damper adds a stroke to every point): about half a
 * second of work and an answer of at most about 20 MB.
 */
export const MAX_RESPONSE_WORK = 350_000;
/** Relative tolerance of the symmetry check, against the largest entry of the matrix: the engine's own. */
export const MATRIX_SYMMETRY_TOLERANCE = SYMMETRY_TOLERANCE;

const finite = z.number({ error: typeError('must be a finite number') });
const dampingRatio = finite
  .min(0, { error: 'must be a damping ratio in [0, 1): 0 or greater' })
  .lt(1, { error: 'must be a damping ratio in [0, 1): less than 1' });
/** |value| ≤ limit, for entries that may be negative (coupling terms, initial conditions, times). */
const bounded = (limit: number, unit: string, what: string) =>
  finite.refine((value) => Math.abs(value) <= limit, { error: `must be between −${formatNumber(limit)} and ${formatNumber(limit)} ${unit} (${what})` });

const matrix = z
  .array(z.array(finite, { error: typeError('must be an array of numbers (a matrix row)') }), { error: typeError('must be an array of rows (a square matrix)') })
  .min(1, { error: 'must have at least one row' })
  .max(MAX_DOF, { error: `must have at most ${MAX_DOF} rows` });

type Issues = z.core.$RefinementCtx;

/** Square shape, and symmetry when the shape is right. Returns the size, or null when the shape is wrong. */
function checkSquareSymmetric(value: number[][], field: string, ctx: Issues): number | null {
  const n = value.length;
  let ok = true;
  value.forEach((row, i) => {
    if (row.length !== n) {
      ctx.addIssue({ code: 'custom', path: [field, i], message: `must have ${n} entries (the matrix has ${n} rows and must be square)` });
      ok = false;
    }
  });
  if (!ok) return null;
  let largest = 0;
  for (const row of value) for (const entry of row) largest = Math.max(largest, Math.abs(entry));
  const tolerance = MATRIX_SYMMETRY_TOLERANCE * largest;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (Math.abs(value[i][j] - value[j][i]) > tolerance) {
        ctx.addIssue({
          code: 'custom',
          path: [field, j, i],
          message: `must equal entry (${i}, ${j}) = ${value[i][j]} (the matrix must be symmetric; got ${value[j][i]})`,
        });
      }
    }
  }
  return n;
}

/** Refuses entries beyond ±limit, naming the lower-triangle entry (the upper one must equal it). */
function checkEntryMagnitudes(value: number[][], field: string, limit: number, unit: string, ctx: Issues): void {
  for (let i = 0; i < value.length; i++) {
    for (let j = 0; j <= i; j++) {
      const entry = value[i][j];
      if (Math.abs(entry) > limit) {
        ctx.addIssue({ code: 'custom', path: [field, i, j], message: `must be between −${formatNumber(limit)} and ${formatNumber(limit)} ${unit} (an entry of the matrix; got ${entry})` });
      }
    }
  }
}

/**
 * The condition of a mass or stiffness matrix: its (non-zero) diagonal entries must lie within MAX_DIAGONAL_RATIO of
 * each other, else the small ones lose their digits beside the large ones (and a stiff DOF beside a soft one reads
 * as a rigid-body mode). Names the smallest entry.
 */
function checkDiagonalSpread(value: number[][], field: string, unit: string, ctx: Issues): void {
  let largest = 0;
  let largestAt = 0;
  let smallest = Infinity;
  let smallestAt = 0;
  value.forEach((row, i) => {
    const d = row[i];
    if (!(d > 0)) return;
    if (d > largest) {
      largest = d;
      largestAt = i;
    }
    if (d < smallest) {
      smallest = d;
      smallestAt = i;
    }
  });
  if (largest > 0 && largest / smallest > MAX_DIAGONAL_RATIO) {
    ctx.addIssue({
      code: 'custom',
      path: [field, smallestAt, smallestAt],
      message: `must be at least ${formatNumber(largest / MAX_DIAGONAL_RATIO)} ${unit}, 1/${formatNumber(MAX_DIAGONAL_RATIO)} of the largest diagonal entry (${largest} ${unit} at (${largestAt}, ${largestAt})); got ${smallest}: entries spread over more orders of magnitude leave the small ones too few digits for trustworthy modes`,
    });
  }
}

function checkMassAndStiffness(value: { massMatrixKg: number[][]; stiffnessMatrixNPerM: number[][] }, ctx: Issues): number | null {
  const n = checkSquareSymmetric(value.massMatrixKg, 'massMatrixKg', ctx);
  const nk = checkSquareSymmetric(value.stiffnessMatrixNPerM, 'stiffnessMatrixNPerM', ctx);
  if (n !== null) {
    value.massMatrixKg.forEach((row, i) => {
      if (!(row[i] > 0)) ctx.addIssue({ code: 'custom', path: ['massMatrixKg', i, i], message: `must be greater than 0 (a diagonal mass; got ${row[i]})` });
      else if (row[i] < MIN_MASS_KG || row[i] > MAX_MASS_KG) {
        ctx.addIssue({ code: 'custom', path: ['massMatrixKg', i, i], message: `must be ${rangeText(MIN_MASS_KG, MAX_MASS_KG, 'kg', 'a diagonal mass')}; got ${row[i]}` });
      }
    });
    checkEntryMagnitudes(value.massMatrixKg, 'massMatrixKg', MAX_MASS_KG, 'kg', ctx);
    checkDiagonalSpread(value.massMatrixKg, 'massMatrixKg', 'kg', ctx);
  }
  if (nk !== null) {
    value.stiffnessMatrixNPerM.forEach((row, i) => {
      if (row[i] < 0) ctx.addIssue({ code: 'custom', path: ['stiffnessMatrixNPerM', i, i], message: `must be at least 0 (a diagonal stiffness; got ${row[i]})` });
    });
    checkEntryMagnitudes(value.stiffnessMatrixNPerM, 'stiffnessMatrixNPerM', MAX_STIFFNESS_N_PER_M, 'N/m', ctx);
    checkDiagonalSpread(value.stiffnessMatrixNPerM, 'stiffnessMatrixNPerM', 'N/m', ctx);
  }
  if (n !== null && nk !== null && n !== nk) {
    ctx.addIssue({ code: 'custom', path: ['stiffnessMatrixNPerM'], message: `must be ${n}×${n} like massMatrixKg (got ${nk}×${nk})` });
    return null;
  }
  return n !== null && nk !== null ? n : null;
}

// ---------- modes ----------
export const modesRequestSchema = z
  .strictObject({ massMatrixKg: matrix, stiffnessMatrixNPerM: matrix })
  .superRefine((value, ctx) => {
    checkMassAndStiffness(value, ctx);
  });
export const modeSchema = z.object({
  frequencyHz: z.number(),
  angularFrequencyRadPerS: z.number(),
  shape: z.array(z.number()),
});
export const modesResponseSchema = z.object({ modes: z.array(modeSchema) });

// ---------- tune ----------
export const tuneRequestSchema = z.strictObject({
  method: tuningMethodSchema,
  massRatio: finite
    .gt(0, { error: 'must be greater than 0', abort: true })
    .min(MIN_MASS_RATIO, { error: `must be at least ${formatNumber(MIN_MASS_RATIO)} (a lighter damper does nothing measurable and has no optimum tuning)` })
    .max(1, { error: 'must be at most 1 (the damper heavier than the modal mass)' }),
  structureFrequencyHz: frequencyHzSchema('a natural frequency', 'must be a finite number'),
  structureDampingRatio: dampingRatio.default(0),
});
export const tuneResponseSchema = z.object({
  frequencyRatio: z.number(),
  tmdFrequencyHz: z.number(),
  tmdDampingRatio: z.number(),
  /** max over frequency of |X_s| K / F for the tuned system (continuous peak search). */
  peakAmplification: z.number(),
});

// ---------- response ----------
// The structure mode and the damper are those of every command (compute-shapes.ts, re-exported above).
export const responseRequestSchema = z
  .strictObject({
    structure: structureModeSchema,
    tmds: tmdListSchema(),
    forceAmplitudeN: forceNSchema('a force amplitude', 'must be a finite number'),
    frequenciesHz: z
      .array(frequencyHzSchema('a forcing frequency', 'must be a finite number'), { error: typeError('must be an array of frequencies in Hz') })
      .min(1, { error: 'must have at least one frequency' })
      .max(MAX_POINTS, { error: `must have at most ${MAX_POINTS} frequencies` }),
  })
  .superRefine((value, ctx) => {
    checkTotalMassRatio(value, ctx);
    const work = value.frequenciesHz.length * Math.max(1, value.tmds.length);
    if (work > MAX_RESPONSE_WORK) {
      ctx.addIssue({
        code: 'custom',
        path: ['frequenciesHz'],
        message: `frequencies × dampers must be at most ${MAX_RESPONSE_WORK.toLocaleString('en-GB')} (got ${value.frequenciesHz.length.toLocaleString('en-GB')} × ${value.tmds.length} = ${work.toLocaleString('en-GB')}); split the frequencies into several requests`,
      });
    }
  });
export const responsePointSchema = z.object({
  frequencyHz: z.number(),
  structureDisplacementM: z.number(),
  structureAccelerationMPerS2: z.number(),
  tmdStrokeM: z.array(z.number()),
});
export const responseResponseSchema = z.object({
  points: z.array(responsePointSchema),
  peak: z.object({ frequencyHz: z.number(), structureAccelerationMPerS2: z.number() }),
});

// ---------- free ----------
export const freeRequestSchema = z
  .strictObject({
    massMatrixKg: matrix,
    stiffnessMatrixNPerM: matrix,
    initialDisplacementM: z.array(bounded(MAX_DISPLACEMENT_M, 'm', 'an initial displacement'), { error: typeError('must be an array of displacements in m, one per DOF') }),
    initialVelocityMPerS: z.array(bounded(MAX_VELOCITY_M_PER_S, 'm/s', 'an initial velocity'), { error: typeError('must be an array of velocities in m/s, one per DOF') }),
    timesS: z
      .array(bounded(MAX_TIME_S, 's', 'a time'), { error: typeError('must be an array of times in s') })
      .min(1, { error: 'must have at least one time' })
      .max(MAX_POINTS, { error: `must have at most ${MAX_POINTS} times` }),
  })
  .superRefine((value, ctx) => {
    const n = checkMassAndStiffness(value, ctx);
    if (n === null) return;
    for (const field of ['initialDisplacementM', 'initialVelocityMPerS'] as const) {
      if (value[field].length !== n) {
        ctx.addIssue({ code: 'custom', path: [field], message: `must have ${n} entries, one per DOF (got ${value[field].length})` });
      }
    }
    if (value.timesS.length * n > MAX_FREE_VALUES) {
      ctx.addIssue({
        code: 'custom',
        path: ['timesS'],
        message: `times × DOF must be at most ${MAX_FREE_VALUES.toLocaleString('en-GB')} values (got ${(value.timesS.length * n).toLocaleString('en-GB')}); split the times into several requests`,
      });
    } else if (value.timesS.length * n * n > MAX_FREE_WORK) {
      // The modal sum costs times × DOF² operations: keep one request to a fraction of a second.
      ctx.addIssue({
        code: 'custom',
        path: ['timesS'],
        message: `times × DOF² must be at most ${MAX_FREE_WORK.toLocaleString('en-GB')} (got ${(value.timesS.length * n * n).toLocaleString('en-GB')}); split the times into several requests`,
      });
    }
  });
export const freeResponseSchema = z.object({ displacementsM: z.array(z.array(z.number())) });

export type ModesRequest = z.infer<typeof modesRequestSchema>;
export type ModesResponse = z.infer<typeof modesResponseSchema>;
export type TuneRequest = z.input<typeof tuneRequestSchema>;
export type TuneRequestParsed = z.output<typeof tuneRequestSchema>;
export type TuneResponse = z.infer<typeof tuneResponseSchema>;
export type ResponseRequest = z.infer<typeof responseRequestSchema>;
export type ResponseResponse = z.infer<typeof responseResponseSchema>;
export type FreeRequest = z.infer<typeof freeRequestSchema>;
export type FreeResponse = z.infer<typeof freeResponseSchema>;
