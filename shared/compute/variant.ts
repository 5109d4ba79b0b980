/**
 * A tuning variant's result and plot curves, computed from the things it points at (a mode, load cases, comfort
 * criteria) and its own settings. Pure: the server runs it to store a variant's result, the browser's worker runs it
 * for plots as the engineer types. Every load case goes through the `assess` command itself (request schema, then
 * run), so a variant's numbers are those of `calc assess` on the same request, bit for bit.
 *
 * - The damper: total mass μ M, tuned by the variant's method to the mode (re-tuned when the mode changes) or set by
 *   hand (kept when the mode changes); `unitCount` equal units share mass, spring and damper (each has the whole
 *   damper's frequency and damping ratio), which only the hardware sheet sees.
 * - Detuning: the damper held, the structure's frequency moved over f (1 ± r) (and the damper's damping ratio over
 *   ζ (1 ± d) when a damping tolerance is given): the worst utilisation over the band and every load case. Steady
 *   load cases use the engine's continuous search over structure frequencies (the one `size` uses); a moving walker,
 *   which has no steady envelope, is simulated at f (1 − r), f and f (1 + r).
 * - Size: the smallest mass ratio whose damper, tuned by the variant's method, keeps that worst utilisation ≤ 1.
 */

import type { z } from 'zod';
import { ComputeInputError } from './types';
import { designCommands } from './design-commands';
import { toApiIssues, type ApiIssue } from '../contracts/errors';
import type { AssessRequest, AssessResponse, criteriaSchema, loadCaseSchema } from '../contracts/compute-design';
import type { Direction } from '../contracts/compute-shapes';
import {
  DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO,
  MAX_VARIANT_MASS_RATIO,
  isManualTuning,
  type VariantComputation,
  type VariantCurves,
  type VariantDetuning,
  type VariantHardware,
  type VariantLoadCaseResult,
  type VariantResponseBand,
  type VariantRobustnessMap,
  type VariantSize,
  type VariantTimeHistory,
  type VariantTmd,
  type VariantTuning,
} from '../contracts/variants';
import { illinoisOnLogMassRatio, tuningRatios, worstPeakOverStructureFrequencies } from '../engine/sizing';
import { buildLoadEnvelope, type LoadEnvelope, type SteadyLoadCase } from '../engine/loads/load-envelope';
import { findEnvelopePeak, maximiseContinuous } from '../engine/loads/response-envelope';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem, evaluateStructureAccelerationPerN } from '../engine/response';
import { resolveComfortLimit, type ComfortLimit, type CriteriaInput } from '../engine/criteria';
import { designCaution, massRatioWarnings, type DesignWarning } from '../engine/design';
import { mapRobustness } from '../engine/robustness';
import { simulateMovingWalker } from '../engine/moving-walker';

/**
 * Version of the numbers a variant's result holds: stored beside each result and part of its inputs' hash, so a
 * change of the engine that moves the numbers (raise it then) recomputes every stored result on its next read.
 */
export const variantEngineVersion = '2026.12-1';

export type LoadCaseSpec = z.output<typeof loadCaseSchema>;
export type CriteriaSpec = z.output<typeof criteriaSchema>;

/** The mode a variant treats, as stored (modeShapeMean: mean |φ| over the deck, used by crowd load cases that give none). */
export interface VariantModeInput {
  modalMassKg: number;
  frequencyHz: number;
  dampingRatio: number;
  direction: Direction;
  modeShapeMean?: number | null;
}

export interface VariantLoadCaseInput {
  id: string;
  name: string;
  spec: LoadCaseSpec;
}

/** The variant's own settings. */
export interface VariantSettings {
  massRatio: number;
  tuning: VariantTuning;
  unitCount?: number;
  structureFrequencyToleranceRatio?: number;
  tmdDampingToleranceRatio?: number | null;
  hardware?: VariantHardware | null;
}

export interface VariantComputeInput {
  mode: VariantModeInput;
  loadCases: readonly VariantLoadCaseInput[];
  criteria: { spec: CriteriaSpec };
  variant: VariantSettings;
}

// ---------- field paths ----------

/**
 * The variant's field behind a path of the engine's request: the mode (`modeId`), the load case (`loadCaseIds.<i>`),
 * the criteria (`criteriaId`), the damper (`massRatio`, `tuning`), the hardware options.
 */
export function variantFieldOf(enginePath: string, loadCaseIndex: number): string {
  const [head, ...rest] = enginePath.split('.');
  switch (head) {
    case 'structure':
      return 'modeId';
    case 'structureDampingRatio':
      // A method that gives no tuning for the mode's damping ratio (Ioi & Ikeda's fit, H∞ above 1/√2).
      return 'tuning';
    case 'loadCase':
      return `loadCaseIds.${loadCaseIndex}`;
    case 'criteria':
      return 'criteriaId';
    case 'tmds':
      return rest[1] === 'frequencyHz' || rest[1] === 'dampingRatio' ? 'tuning' : 'massRatio';
    case 'massRatio':
      return 'massRatio';
    case 'method':
      return 'tuning';
    case 'hardware':
      return rest[0] === 'unitCount' ? 'unitCount' : enginePath;
    default:
      return enginePath === '' ? `loadCaseIds.${loadCaseIndex}` : enginePath;
  }
}

function variantIssues(issues: readonly ApiIssue[], loadCaseIndex: number): ApiIssue[] {
  return issues.map((issue) => {
    const path = variantFieldOf(issue.path, loadCaseIndex);
    return { path, message: issue.message.startsWith(`${path}:`) ? issue.message : `${path}: ${issue.message}` };
  });
}

/** Runs engine code for load case `i`, turning its refusals into ComputeInputError naming the variant's field. */
function asVariantError<T>(loadCaseIndex: number, run: () => T): T {
  try {
    return run();
  } catch (error) {
    if (error instanceof ComputeInputError) {
      const issues = variantIssues(error.issues, loadCaseIndex);
      throw new ComputeInputError(issues.length === 1 ? issues[0].message : error.message, issues);
    }
    if (error instanceof RangeError || (error instanceof Error && error.name === 'EngineInputError')) {
      const field = (error as Error & { path?: string; field?: string }).path ?? (error as Error & { field?: string }).field ?? /^([A-Za-z][\w.]*)/.exec(error.message)?.[1] ?? '';
      const path = variantFieldOf(field, loadCaseIndex);
      throw new ComputeInputError(`${path}: ${error.message}`, [{ path, message: `${path}: ${error.message}` }]);
    }
    throw error;
  }
}

// ---------- the damper ----------

/** The whole damper of a variant on a mode: mass μ M, frequency and damping ratio by its method or by hand. */
export function tuneVariantDamper(mode: Pick<VariantModeInput, 'modalMassKg' | 'frequencyHz' | 'dampingRatio'>, massRatio: number, tuning: VariantTuning): VariantTmd {
  const massKg = massRatio * mode.modalMassKg;
  if (isManualTuning(tuning)) return { massKg, frequencyHz: tuning.frequencyHz, dampingRatio: tuning.dampingRatio };
  const ratios = asVariantError(0, () => tuningRatios(tuning.method, massRatio, mode.dampingRatio));
  return { massKg, frequencyHz: ratios.frequencyRatio * mode.frequencyHz, dampingRatio: ratios.tmdDampingRatio };
}

/** A crowd load case that gives no mean |φ| takes the mode's, when the mode has one. */
function loadCaseForMode(spec: LoadCaseSpec, mode: VariantModeInput): LoadCaseSpec {
  if ((spec.kind === 'crowd' || spec.kind === 'lateral') && spec.modeShapeMean === undefined && mode.modeShapeMean != null) {
    return { ...spec, modeShapeMean: mode.modeShapeMean };
  }
  return spec;
}

/**
 * The `assess` request of load case `loadCaseIndex` for the variant's damper (`tmd`), optionally with the structure's
 * frequency moved: exactly what `calc assess` would be given.
 */
export function buildVariantAssessRequest(
  input: VariantComputeInput,
  loadCaseIndex: number,
  tmd: VariantTmd,
  structureFrequencyHz = input.mode.frequencyHz,
): z.input<typeof designCommands.assess.request> {
  const { mode, variant } = input;
  return {
    structure: { modalMassKg: mode.modalMassKg, frequencyHz: structureFrequencyHz, dampingRatio: mode.dampingRatio, direction: mode.direction },
    tmds: [tmd],
    loadCase: loadCaseForMode(input.loadCases[loadCaseIndex].spec, mode),
    criteria: input.criteria.spec,
    hardware: { ...(variant.hardware ?? {}), unitCount: variant.unitCount ?? 1 },
  };
}

/** Parses and runs `assess` (the command's own schema and run), refusals named by the variant's fields. */
function runAssess(request: unknown, loadCaseIndex: number): { request: AssessRequest; answer: AssessResponse } {
  const command = designCommands.assess;
  const parsed = command.request.safeParse(request);
  if (!parsed.success) {
    const issues = variantIssues(toApiIssues(parsed.error), loadCaseIndex);
    throw new ComputeInputError(issues.length === 1 ? issues[0].message : 'the engine refuses this combination of mode, load case and criteria', issues);
  }
  const answer = asVariantError(loadCaseIndex, () => command.run(parsed.data) as AssessResponse);
  return { request: parsed.data as AssessRequest, answer };
}

// ---------- detuning ----------

interface LoadCaseWorst {
  worstPeakAccelerationMPerS2: number;
  worstUtilisation: number;
  atStructureFrequencyHz: number;
  atTmdDampingRatio: number;
}

/** Damper damping ratios of the detuning check: the tuned one, and its ± tolerance when given. */
function dampingRatiosOf(tmd: VariantTmd, toleranceRatio: number | null | undefined): number[] {
  const out = [tmd.dampingRatio];
  if (toleranceRatio) {
    out.push(tmd.dampingRatio * (1 - toleranceRatio));
    const high = tmd.dampingRatio * (1 + toleranceRatio);
    if (high < 1) out.push(high);
  }
  return out;
}

function frequencyBandOf(input: VariantComputeInput): [number, number] {
  const r = input.variant.structureFrequencyToleranceRatio ?? DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO;
  const f = input.mode.frequencyHz;
  return [f * (1 - r), f * (1 + r)];
}

/** One load case's parsed pieces for repeated evaluation at many dampers. */
interface PreparedLoadCase {
  index: number;
  request: AssessRequest;
  envelope: LoadEnvelope | null;
  limit: ComfortLimit;
}

function prepareLoadCase(input: VariantComputeInput, index: number, tmd: VariantTmd): PreparedLoadCase {
  const parsed = designCommands.assess.request.safeParse(buildVariantAssessRequest(input, index, tmd));
  if (!parsed.success) {
    const issues = variantIssues(toApiIssues(parsed.error), index);
    throw new ComputeInputError(issues[0]?.message ?? 'invalid', issues);
  }
  const request = parsed.data as AssessRequest;
  return asVariantError(index, () => {
    const envelope = request.loadCase.kind === 'moving-walker' ? null : buildLoadEnvelope(request.structure, request.loadCase as SteadyLoadCase);
    const limit = resolveComfortLimit(request.criteria as CriteriaInput, request.structure.direction);
    return { index, request, envelope, limit };
  });
}

/** Worst peak and utilisation of one load case over the detuning band, the damper held (`tmd`; `null`: bare). */
function worstOverBand(input: VariantComputeInput, prepared: PreparedLoadCase, tmd: VariantTmd | null, rangeHz: [number, number]): LoadCaseWorst {
  const { request, envelope, limit } = prepared;
  const structure = request.structure;
  const dampingRatios = tmd ? dampingRatiosOf(tmd, input.variant.tmdDampingToleranceRatio) : [0];
  let best: LoadCaseWorst | null = null;
  for (const zeta of dampingRatios) {
    const tmds = tmd ? [{ ...tmd, dampingRatio: zeta }] : [];
    let candidate: LoadCaseWorst;
    if (envelope) {
      const peak = worstPeakOverStructureFrequencies(structure, tmds, envelope.bands, rangeHz);
      if (!limit.frequencyDependent) {
        candidate = {
          worstPeakAccelerationMPerS2: peak.value,
          worstUtilisation: peak.value / limit.limitMPerS2(0),
          atStructureFrequencyHz: peak.structureFrequencyHz,
          atTmdDampingRatio: zeta,
        };
      } else {
        const utilisationAt = (fs: number) =>
          findEnvelopePeak(createModeTmdSystem({ ...structure, frequencyHz: fs }, tmds), envelope.bands, 'structureAcceleration', { divisor: limit.limitMPerS2 }).value;
        const worst =
          rangeHz[1] > rangeHz[0]
            ? maximiseContinuous(utilisationAt, rangeHz[0], rangeHz[1], { samples: 16, relativeTolerance: 1e-5 })
            : { value: utilisationAt(rangeHz[0]), frequencyHz: rangeHz[0] };
        candidate = { worstPeakAccelerationMPerS2: peak.value, worstUtilisation: worst.value, atStructureFrequencyHz: worst.frequencyHz, atTmdDampingRatio: zeta };
      }
    } else {
      // The moving walker: one crossing at each edge of the band and at the mode's own frequency.
      const frequencies = rangeHz[1] > rangeHz[0] ? [rangeHz[0], structure.frequencyHz, rangeHz[1]] : [rangeHz[0]];
      candidate = { worstPeakAccelerationMPerS2: -Infinity, worstUtilisation: -Infinity, atStructureFrequencyHz: rangeHz[0], atTmdDampingRatio: zeta };
      for (const fs of frequencies) {
        const requestAt = { ...request, structure: { ...structure, frequencyHz: fs }, tmds };
        const answer = asVariantError(prepared.index, () => designCommands.assess.run(requestAt) as AssessResponse);
        const utilisation = answer.utilisation ?? 0;
        candidate.worstPeakAccelerationMPerS2 = Math.max(candidate.worstPeakAccelerationMPerS2, answer.peakAccelerationMPerS2);
        if (utilisation > candidate.worstUtilisation) {
          candidate.worstUtilisation = utilisation;
          candidate.atStructureFrequencyHz = fs;
        }
      }
    }
    const peakSoFar: number = best === null ? -Infinity : best.worstPeakAccelerationMPerS2;
    if (best === null || candidate.worstUtilisation > best.worstUtilisation) best = { ...candidate };
    best.worstPeakAccelerationMPerS2 = Math.max(peakSoFar, candidate.worstPeakAccelerationMPerS2);
  }
  return best as LoadCaseWorst;
}

function detuningOf(input: VariantComputeInput, prepared: readonly PreparedLoadCase[], tmd: VariantTmd): VariantDetuning {
  const rangeHz = frequencyBandOf(input);
  const perLoadCase = prepared.map((p) => ({ loadCaseId: input.loadCases[p.index].id, ...worstOverBand(input, p, tmd, rangeHz) }));
  let worst = perLoadCase[0];
  for (const entry of perLoadCase) if (entry.worstUtilisation > worst.worstUtilisation) worst = entry;
  return {
    structureFrequencyToleranceRatio: input.variant.structureFrequencyToleranceRatio ?? DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO,
    tmdDampingToleranceRatio: input.variant.tmdDampingToleranceRatio ?? null,
    structureFrequencyRangeHz: rangeHz,
    worstPeakAccelerationMPerS2: Math.max(...perLoadCase.map((e) => e.worstPeakAccelerationMPerS2)),
    worstUtilisation: worst.worstUtilisation,
    verdict: worst.worstUtilisation <= 1 ? 'pass' : 'fail',
    atStructureFrequencyHz: worst.atStructureFrequencyHz,
    atTmdDampingRatio: worst.atTmdDampingRatio,
    loadCaseId: worst.loadCaseId,
    loadCases: perLoadCase,
  };
}

function checkVariantShape(input: VariantComputeInput): void {
  if (input.loadCases.length === 0) {
    throw new ComputeInputError('loadCaseIds: must hold at least one load case', [{ path: 'loadCaseIds', message: 'loadCaseIds: must hold at least one load case' }]);
  }
  const mu = input.variant.massRatio;
  if (!(mu > 0 && mu <= MAX_VARIANT_MASS_RATIO)) {
    const message = `massRatio: must be greater than 0 and at most ${MAX_VARIANT_MASS_RATIO} (got ${mu})`;
    throw new ComputeInputError(message, [{ path: 'massRatio', message }]);
  }
}

/** The moving walker's answer as a result stores it: its figures without the per-step series. */
function storedAnswer(answer: AssessResponse): Omit<AssessResponse, 'timeHistory'> & { timeHistory?: VariantLoadCaseResult['timeHistory'] } {
  if (!answer.timeHistory) return answer;
  const { timesS: _t, structureAccelerationMPerS2: _a, runningRms1sMPerS2: _r, ...figures } = answer.timeHistory;
  return { ...answer, timeHistory: figures };
}

function toleranceWarnings(input: VariantComputeInput, prepared: readonly PreparedLoadCase[]): DesignWarning[] {
  const [lo, hi] = frequencyBandOf(input);
  const out: DesignWarning[] = [];
  for (const p of prepared) {
    const range = p.envelope?.structureFrequencyRangeHz;
    if (range && hi > lo && (lo < range[0] || hi > range[1])) {
      out.push({
        code: 'tolerance-outside-load-model',
        message: `${input.loadCases[p.index].name}: part of the detuning band ${lo.toPrecision(4)}–${hi.toPrecision(4)} Hz lies outside the ${p.envelope?.kind} load model's ${range[0]}–${range[1]} Hz`,
      });
    }
  }
  return out;
}

/** A variant's result: the damper, each load case's `assess` answer, the governing load case and the detuning check. */
export function computeVariantResult(input: VariantComputeInput): VariantComputation {
  checkVariantShape(input);
  const tmd = tuneVariantDamper(input.mode, input.variant.massRatio, input.variant.tuning);
  const loadCases: VariantLoadCaseResult[] = input.loadCases.map((lc, i) => {
    const { answer } = runAssess(buildVariantAssessRequest(input, i, tmd), i);
    return { ...storedAnswer(answer), loadCaseId: lc.id, name: lc.name };
  });
  let governing = loadCases[0];
  for (const lc of loadCases) if ((lc.utilisation ?? 0) > (governing.utilisation ?? 0)) governing = lc;
  const prepared = input.loadCases.map((_, i) => prepareLoadCase(input, i, tmd));
  const detuning = detuningOf(input, prepared, tmd);
  return {
    tmd,
    massRatio: input.variant.massRatio,
    unitCount: input.variant.unitCount ?? 1,
    loadCases,
    governing: {
      loadCaseId: governing.loadCaseId,
      peakAccelerationMPerS2: governing.peakAccelerationMPerS2,
      utilisation: governing.utilisation ?? 0,
      verdict: (governing.utilisation ?? 0) <= 1 ? 'pass' : 'fail',
    },
    detuning,
    warnings: [...massRatioWarnings(input.variant.massRatio), ...toleranceWarnings(input, prepared)],
    caution: designCaution,
  };
}

// ---------- size ----------

/** Smallest mass ratio the search tries. */
const MIN_SIZE_MASS_RATIO = 1e-3;

interface SizeTrial {
  mu: number;
  tmd: VariantTmd;
  detuning: VariantDetuning;
}

/**
 * The smallest mass ratio whose damper, tuned by the variant's method, meets the criteria on every load case over the
 * detuning band (worst utilisation ≤ 1); the bracket on ln μ is closed by Illinois regula falsi to 0.2 % in μ and the
 * feasible end is answered. Refused for a variant tuned by hand (naming `tuning`), and when even a mass ratio of
 * 25 % does not meet the criteria (naming `massRatio`).
 */
export function computeVariantSize(input: VariantComputeInput): Omit<VariantSize, 'applied' | 'variant'> {
  const tuning = input.variant.tuning;
  if (isManualTuning(tuning)) {
    const message = 'tuning: sizing needs a tuning method (den-hartog, warburton-random, ioi-ikeda, hinf or h2); this variant is tuned by hand';
    throw new ComputeInputError(message, [{ path: 'tuning', message }]);
  }
  if (input.loadCases.length === 0) checkVariantShape(input);
  const rangeHz = frequencyBandOf(input);
  // The load cases' envelopes and limits do not depend on the damper: prepare them once with any damper.
  const prepared = input.loadCases.map((_, i) => prepareLoadCase(input, i, tuneVariantDamper(input.mode, 0.01, { method: 'den-hartog' })));
  let evaluations = 0;
  const trial = (mu: number): SizeTrial => {
    evaluations++;
    const tmd = tuneVariantDamper(input.mode, mu, tuning);
    return { mu, tmd, detuning: detuningOf(input, prepared, tmd) };
  };
  const base = {
    method: tuning.method,
    structureFrequencyRangeHz: rangeHz,
    caution: designCaution,
  };
  const warnings: DesignWarning[] = [...toleranceWarnings(input, prepared)];
  // The bare structure (a moving walker needs no damper either if it already passes).
  const bare = prepared.map((p) => ({ id: input.loadCases[p.index].id, ...worstBare(input, p, rangeHz) }));
  const bareWorst = bare.reduce((a, b) => (b.worstUtilisation > a.worstUtilisation ? b : a));
  if (bareWorst.worstUtilisation <= 1) {
    warnings.push({ code: 'no-damper-needed', message: 'the bare structure already meets the criteria on every load case over the whole detuning band' });
    return {
      ...base, massRatio: 0, tmd: null, worstPeakAccelerationMPerS2: Math.max(...bare.map((b) => b.worstPeakAccelerationMPerS2)),
      worstUtilisation: bareWorst.worstUtilisation, atStructureFrequencyHz: bareWorst.atStructureFrequencyHz, governingLoadCaseId: bareWorst.id,
      evaluations, warnings,
    };
  }
  const top = trial(MAX_VARIANT_MASS_RATIO);
  if (top.detuning.worstUtilisation > 1) {
    const message = `massRatio: no damper up to a mass ratio of ${(100 * MAX_VARIANT_MASS_RATIO).toFixed(0)} % tuned by ${tuning.method} meets the criteria over the detuning band (worst utilisation ${top.detuning.worstUtilisation.toPrecision(4)} at that mass ratio, load case ${top.detuning.loadCaseId})`;
    throw new ComputeInputError(message, [{ path: 'massRatio', message }]);
  }
  const bottom = trial(MIN_SIZE_MASS_RATIO);
  const found =
    bottom.detuning.worstUtilisation <= 1 ? bottom : illinoisOnLogMassRatio(trial, (t) => t.detuning.worstUtilisation, bottom, top);
  warnings.push(...massRatioWarnings(found.mu));
  return {
    ...base,
    massRatio: found.mu,
    tmd: found.tmd,
    worstPeakAccelerationMPerS2: found.detuning.worstPeakAccelerationMPerS2,
    worstUtilisation: found.detuning.worstUtilisation,
    atStructureFrequencyHz: found.detuning.atStructureFrequencyHz,
    governingLoadCaseId: found.detuning.loadCaseId,
    evaluations,
    warnings,
  };
}

function worstBare(input: VariantComputeInput, prepared: PreparedLoadCase, rangeHz: [number, number]): LoadCaseWorst {
  if (prepared.request.structure.dampingRatio === 0 && prepared.envelope) {
    // An undamped bare mode in the loaded band has no finite peak: it never meets a limit.
    return { worstPeakAccelerationMPerS2: Infinity, worstUtilisation: Infinity, atStructureFrequencyHz: input.mode.frequencyHz, atTmdDampingRatio: 0 };
  }
  return worstOverBand(input, prepared, null, rangeHz);
}

// ---------- curves ----------

/** Most points of one band's response curve. */
const MAX_CURVE_POINTS = 600;
/** Uniform points of a band before refinement. */
const INITIAL_CURVE_POINTS = 48;
/** A stretch is split while its midpoint leaves the chord by more than this fraction of the curve's largest value. */
const CURVE_TOLERANCE = 0.002;

/**
 * Samples `evaluate` (several series at once) on [lo, hi] where the curves bend: a uniform start with the hints
 * (resonances, kinks, peaks), then each stretch halved while its midpoint leaves the chord of any series by more than
 * CURVE_TOLERANCE of that series' largest value, breadth first, up to MAX_CURVE_POINTS.
 */
export function sampleAdaptively(
  evaluate: (frequencyHz: number) => number[],
  loHz: number,
  hiHz: number,
  hintsHz: readonly number[] = [],
  options: { initialPoints?: number; maxPoints?: number; tolerance?: number } = {},
): { frequencyHz: number[]; values: number[][] } {
  const initial = options.initialPoints ?? INITIAL_CURVE_POINTS;
  const maxPoints = options.maxPoints ?? MAX_CURVE_POINTS;
  const tolerance = options.tolerance ?? CURVE_TOLERANCE;
  const xs = new Set<number>();
  if (hiHz > loHz) {
    for (let i = 0; i <= initial; i++) xs.add(i === initial ? hiHz : loHz + ((hiHz - loHz) * i) / initial);
  } else {
    xs.add(loHz);
  }
  for (const h of hintsHz) if (h >= loHz && h <= hiHz) xs.add(h);
  const points = [...xs].sort((a, b) => a - b).map((f) => ({ f, v: evaluate(f) }));
  const seriesCount = points[0].v.length;
  const scale = new Array<number>(seriesCount).fill(0);
  const widen = (v: number[]) => v.forEach((value, k) => { if (Number.isFinite(value)) scale[k] = Math.max(scale[k], Math.abs(value)); });
  points.forEach((p) => widen(p.v));
  const minWidth = 1e-9 * Math.max(hiHz - loHz, hiHz);
  let queue: Array<[typeof points[number], typeof points[number]]> = [];
  for (let i = 0; i + 1 < points.length; i++) queue.push([points[i], points[i + 1]]);
  while (queue.length && points.length < maxPoints) {
    const next: typeof queue = [];
    for (const [a, b] of queue) {
      if (points.length >= maxPoints) break;
      if (b.f - a.f < minWidth) continue;
      const m = { f: 0.5 * (a.f + b.f), v: [] as number[] };
      m.v = evaluate(m.f);
      widen(m.v);
      points.push(m);
      let bends = false;
      for (let k = 0; k < seriesCount && !bends; k++) {
        const va = a.v[k];
        const vb = b.v[k];
        const vm = m.v[k];
        if (!Number.isFinite(va) || !Number.isFinite(vb) || !Number.isFinite(vm)) bends = true;
        else if (Math.abs(vm - 0.5 * (va + vb)) > tolerance * scale[k]) bends = true;
      }
      if (bends) next.push([a, m], [m, b]);
    }
    queue = next;
  }
  points.sort((p, q) => p.f - q.f);
  return { frequencyHz: points.map((p) => p.f), values: Array.from({ length: seriesCount }, (_, k) => points.map((p) => p.v[k])) };
}

const finiteOrNull = (v: number) => (Number.isFinite(v) ? v : null);

function responseBands(request: AssessRequest, envelope: LoadEnvelope, tmd: VariantTmd, limit: ComfortLimit): VariantResponseBand[] {
  const structure = request.structure;
  const system = createModeTmdSystem(structure, [tmd]);
  const bare = createModeTmdSystem(structure, []);
  const point = createModeTmdPoint(system);
  const peak = findEnvelopePeak(system, envelope.bands);
  const strokePeak = findEnvelopePeak(system, envelope.bands, 'tmdStroke');
  const barePeak = structure.dampingRatio > 0 ? findEnvelopePeak(bare, envelope.bands) : null;
  return envelope.bands.map((band, b) => {
    const hints = [...system.coupledFrequenciesHz, structure.frequencyHz, ...(band.kinksHz ?? [])];
    if (peak.bandIndex === b) hints.push(peak.frequencyHz);
    if (strokePeak.bandIndex === b) hints.push(strokePeak.frequencyHz);
    if (barePeak && barePeak.bandIndex === b) hints.push(barePeak.frequencyHz);
    const sampled = sampleAdaptively(
      (f) => {
        const force = band.forceN(f);
        evaluateModeTmdSystem(system, f, point);
        return [point.structureAccelerationMPerS2PerN * force, evaluateStructureAccelerationPerN(bare, f) * force, point.tmdStrokeMPerN[0] * force];
      },
      band.loHz,
      band.hiHz,
      hints,
    );
    return {
      label: band.label,
      loHz: band.loHz,
      hiHz: band.hiHz,
      frequencyHz: sampled.frequencyHz,
      accelerationMPerS2: sampled.values[0],
      bareStructureAccelerationMPerS2: sampled.values[1].map(finiteOrNull),
      tmdStrokeM: sampled.values[2],
      ...(limit.frequencyDependent ? { limitMPerS2: sampled.frequencyHz.map((f) => limit.limitMPerS2(f)) } : {}),
    };
  });
}

/** Structure-frequency factors of the map: ±15 % (or the detuning band if wider), its edges and 1. */
function robustnessMap(input: VariantComputeInput, request: AssessRequest, tmd: VariantTmd, limit: ComfortLimit, peakHz: number): VariantRobustnessMap {
  const r = Math.max(0.15, input.variant.structureFrequencyToleranceRatio ?? DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO);
  const tol = input.variant.structureFrequencyToleranceRatio ?? DEFAULT_STRUCTURE_FREQUENCY_TOLERANCE_RATIO;
  const rows = new Set<number>([1, 1 - tol, 1 + tol]);
  const rowCount = 24;
  for (let i = 0; i <= rowCount; i++) rows.add(1 - r + (2 * r * i) / rowCount);
  const d = input.variant.tmdDampingToleranceRatio ?? 0;
  const columns = new Set<number>([0.25, 0.5, 0.75, 1, 1.25, 1.5, 2, 3, 1 - d, 1 + d]);
  const columnFactors = [...columns].filter((c) => c > 0 && tmd.dampingRatio * c < 1).sort((a, b) => a - b);
  const run = (factors: number[]) =>
    mapRobustness({
      structure: request.structure,
      tmds: [tmd],
      loadCase: request.loadCase as SteadyLoadCase,
      structureFrequencyFactors: factors,
      tmdDampingFactors: columnFactors,
    });
  let factors = [...rows].filter((f) => f > 0).sort((a, b) => a - b);
  let map = run(factors);
  // Refine the rows where the worst column changes fast (around the peak of detuning), twice.
  for (let pass = 0; pass < 2; pass++) {
    const worst = map.peakAccelerationMPerS2.map((row) => Math.max(...row));
    const top = Math.max(...worst);
    const extra: number[] = [];
    for (let i = 0; i + 1 < factors.length; i++) {
      if (Math.abs(worst[i + 1] - worst[i]) > 0.05 * top) extra.push(0.5 * (factors[i] + factors[i + 1]));
    }
    if (!extra.length) break;
    const added = run(extra);
    const merged = factors.map((f, i) => ({ f, row: map.peakAccelerationMPerS2[i], bare: map.bareStructurePeakAccelerationMPerS2[i] }));
    extra.forEach((f, i) => merged.push({ f, row: added.peakAccelerationMPerS2[i], bare: added.bareStructurePeakAccelerationMPerS2[i] }));
    merged.sort((a, b) => a.f - b.f);
    factors = merged.map((m) => m.f);
    map = { ...map, structureFrequencyFactors: factors, peakAccelerationMPerS2: merged.map((m) => m.row), bareStructurePeakAccelerationMPerS2: merged.map((m) => m.bare) };
  }
  return {
    structureFrequencyHz: factors.map((f) => f * request.structure.frequencyHz),
    tmdDampingRatio: columnFactors.map((c) => c * tmd.dampingRatio),
    peakAccelerationMPerS2: map.peakAccelerationMPerS2,
    bareStructurePeakAccelerationMPerS2: map.bareStructurePeakAccelerationMPerS2,
    limitMPerS2: limit.limitMPerS2(peakHz),
  };
}

/** Most points of a time history's plot. */
const MAX_TIME_HISTORY_POINTS = 4000;

/** Keeps, of each stretch of `decimation` steps, the step with the largest |value| of each series (peaks are never lost). */
function decimateHistory(series: ReadonlyArray<readonly number[]>, count: number): { indices: number[]; decimation: number } {
  const buckets = Math.max(1, Math.floor(MAX_TIME_HISTORY_POINTS / (series.length || 1)));
  const decimation = Math.max(1, Math.ceil(count / buckets));
  if (decimation === 1) return { indices: Array.from({ length: count }, (_, i) => i), decimation };
  const kept = new Set<number>();
  for (let start = 0; start < count; start += decimation) {
    const end = Math.min(count, start + decimation);
    for (const s of series) {
      let best = start;
      for (let i = start; i < end; i++) if (Math.abs(s[i] ?? 0) > Math.abs(s[best] ?? 0)) best = i;
      kept.add(best);
    }
  }
  return { indices: [...kept].sort((a, b) => a - b), decimation };
}

/**
 * Plot data of one of the variant's load cases: the steady-state response with and without the damper and the
 * damper's stroke over the load's force bands, the robustness map (structure frequency × damper damping ratio), or,
 * for a moving walker, the time history of one crossing with and without the damper.
 */
export function computeVariantCurves(input: VariantComputeInput, loadCaseIndex: number): VariantCurves {
  checkVariantShape(input);
  const loadCase = input.loadCases[loadCaseIndex];
  if (!loadCase) throw new RangeError(`loadCaseIndex ${loadCaseIndex} is out of range for ${input.loadCases.length} load case(s)`);
  const tmd = tuneVariantDamper(input.mode, input.variant.massRatio, input.variant.tuning);
  const { request, answer } = runAssess(buildVariantAssessRequest(input, loadCaseIndex, tmd), loadCaseIndex);
  const prepared = prepareLoadCase(input, loadCaseIndex, tmd);
  const limitMPerS2 = answer.criterion?.limitMPerS2 ?? prepared.limit.limitMPerS2(answer.atFrequencyHz);
  const common = { loadCaseId: loadCase.id, name: loadCase.name, kind: request.loadCase.kind, tmd, limitMPerS2 };
  if (request.loadCase.kind === 'moving-walker') {
    const history = answer.timeHistory;
    if (!history) throw new Error('the moving walker answered without its time history');
    // The bare structure on the same time step (the damper's system needs the finer one), for one time axis.
    const { kind: _kind, ...walker } = request.loadCase;
    const bare = asVariantError(loadCaseIndex, () => simulateMovingWalker(request.structure, [], { ...walker, timeStepS: history.timeStepS }));
    const count = Math.min(history.timesS.length, bare.timesS.length);
    const { indices, decimation } = decimateHistory([history.structureAccelerationMPerS2, bare.structureAccelerationMPerS2], count);
    const timeHistory: VariantTimeHistory = {
      timesS: indices.map((i) => history.timesS[i]),
      structureAccelerationMPerS2: indices.map((i) => history.structureAccelerationMPerS2[i]),
      bareStructureAccelerationMPerS2: indices.map((i) => bare.structureAccelerationMPerS2[i]),
      runningRms1sMPerS2: indices.map((i) => history.runningRms1sMPerS2[i]),
      decimation,
      peakAccelerationMPerS2: history.peakAccelerationMPerS2,
      bareStructurePeakAccelerationMPerS2: history.bareStructurePeakAccelerationMPerS2,
    };
    return { ...common, response: [], peak: null, bareStructurePeak: null, robustness: null, timeHistory };
  }
  const envelope = prepared.envelope as LoadEnvelope;
  return {
    ...common,
    response: responseBands(request, envelope, tmd, prepared.limit),
    peak: { frequencyHz: answer.atFrequencyHz, accelerationMPerS2: answer.peakAccelerationMPerS2 },
    bareStructurePeak: { frequencyHz: answer.bareStructureAtFrequencyHz, accelerationMPerS2: answer.bareStructurePeakAccelerationMPerS2 },
    robustness: asVariantError(loadCaseIndex, () => robustnessMap(input, request, tmd, prepared.limit, answer.atFrequencyHz)),
    timeHistory: null,
  };
}
