/**
 * `size`: the smallest mass ratio μ whose tuned damper keeps the worst peak acceleration within the limit for every
 * structure frequency in f0 (1 ± r). The damper is tuned once, to the nominal f0 (and ζ_s) by the chosen method of
 * the engine, and stays put while the structure's frequency moves (detuning by crowds, temperature, as-built
 * stiffness). worst(μ) = max over f_s in the tolerance band of the continuous peak over the load envelope.
 * The root of ln(worst(μ) / limit) in ln μ is bracketed and found by the Illinois variant of regula falsi (a
 * bisection that converges superlinearly), stopped when the bracket is within 0.2 % in μ; the answer is the
 * feasible end of the bracket, so it meets the limit and is exact to well within 1 % in mass ratio.
 */

import type { StructureMode, TmdParameters, TuningMethod } from './types';
import type { SizeResponse } from '../contracts/compute-design';
import { tuneDenHartog, tuneH2, tuneHInfinity, tuneIoiIkeda, tuneWarburtonRandom, type TuningRatios } from './tuning';
import { buildLoadEnvelope, LoadCaseError, type SteadyLoadCase } from './loads/load-envelope';
import {
  findEnvelopePeak,
  maximiseContinuous,
  unboundedBareFrequencyHz,
  type EnvelopeQuantity,
  type ForceBand,
} from './loads/response-envelope';
import { createModeTmdSystem } from './response';
import { buildHardwareEntry, type HardwareOptions } from './hardware';
import {
  bareUnboundedWarning,
  designCaution,
  frequencyRangeWarnings,
  massRatioWarnings,
  type DesignStructure,
  type DesignWarning,
} from './design';

export interface SizeInput {
  structure: DesignStructure;
  method: TuningMethod;
  loadCase: SteadyLoadCase;
  peakAccelerationLimitMPerS2: number;
  structureFrequencyToleranceRatio?: number;
  /** Upper end of the search (default 0.25). */
  maxMassRatio?: number;
  hardware?: HardwareOptions;
}

/** The answer of `size`: the type of its contract (compute-design.ts), not a copy of it. */
export type SizeResult = SizeResponse;

/** Tuning ratios of one damper by a method of the engine (adapter over shared/engine/tuning). */
export function tuningRatios(method: TuningMethod, massRatio: number, structureDampingRatio: number): TuningRatios {
  switch (method) {
    case 'den-hartog':
      return tuneDenHartog(massRatio);
    case 'warburton-random':
      return tuneWarburtonRandom(massRatio);
    case 'ioi-ikeda':
      return tuneIoiIkeda(massRatio, structureDampingRatio);
    case 'hinf':
      return tuneHInfinity(massRatio, structureDampingRatio);
    case 'h2':
      return tuneH2(massRatio, structureDampingRatio);
  }
}

/**
 * Worst (largest) envelope peak of `quantity` over structure frequencies in [lo, hi], the structure's modal mass and
 * damping ratio and the dampers fixed (the structure frequency of `structure` itself is not used).
 */
export function worstPeakOverStructureFrequencies(
  structure: StructureMode,
  tmds: readonly TmdParameters[],
  bands: readonly ForceBand[],
  rangeHz: readonly [number, number],
  quantity: EnvelopeQuantity = 'structureAcceleration',
): { value: number; structureFrequencyHz: number } {
  const peakAt = (structureFrequencyHz: number) =>
    findEnvelopePeak(createModeTmdSystem({ ...structure, frequencyHz: structureFrequencyHz }, tmds), bands, quantity).value;
  if (rangeHz[1] <= rangeHz[0]) return { value: peakAt(rangeHz[0]), structureFrequencyHz: rangeHz[0] };
  const worst = maximiseContinuous(peakAt, rangeHz[0], rangeHz[1], { samples: 16, relativeTolerance: 1e-5 });
  return { value: worst.value, structureFrequencyHz: worst.frequencyHz };
}

interface Trial {
  mu: number;
  tmd: { massKg: number; frequencyHz: number; dampingRatio: number };
  /** Worst peak acceleration over the structure-frequency band, m/s². */
  value: number;
  structureFrequencyHz: number;
}

/** Closed-form tunings that stand in for the numerical ones while the answer is being located. */
const proxyMethods: Partial<Record<TuningMethod, TuningMethod>> = { hinf: 'ioi-ikeda', h2: 'warburton-random' };

/** Bracket width at which the search stops, in ln μ (0.2 % in μ). */
const bracketTolerance = Math.log(1.002);

/**
 * Illinois regula falsi on h(x) = ln(excess(trial)), x = ln μ, between an infeasible `lo` (h > 0) and a feasible
 * `hi` (h ≤ 0); returns the last feasible trial once the bracket is within 0.2 % in μ. `excess` is the worst
 * response over its limit (feasible at 1 or less).
 */
export function illinoisOnLogMassRatio<T extends { mu: number }>(trialAt: (mu: number) => T, excess: (trial: T) => number, lo: T, hi: T): T {
  let xLo = Math.log(lo.mu);
  let xHi = Math.log(hi.mu);
  let hLo = Math.log(excess(lo));
  let hHi = Math.log(excess(hi));
  let best = hi;
  let side = 0;
  for (let iteration = 0; iteration < 100 && xHi - xLo > bracketTolerance; iteration++) {
    let x = (xLo * hHi - xHi * hLo) / (hHi - hLo);
    x = Math.min(Math.max(x, xLo + 0.25 * bracketTolerance), xHi - 0.25 * bracketTolerance);
    if (!(x > xLo && x < xHi)) x = 0.5 * (xLo + xHi);
    const trial = trialAt(Math.exp(x));
    const h = Math.log(excess(trial));
    if (h > 0) {
      xLo = x;
      hLo = h;
      if (side === -1) hHi /= 2;
      side = -1;
    } else {
      xHi = x;
      hHi = h;
      best = trial;
      if (side === 1) hLo /= 2;
      side = 1;
    }
  }
  return best;
}

function illinois(worstFor: (mu: number) => Trial, limit: number, lo: Trial, hi: Trial): Trial {
  return illinoisOnLogMassRatio(worstFor, (trial) => trial.value / limit, lo, hi);
}

function findMassRatio(worstFor: (mu: number) => Trial, limit: number, minMassRatio: number, feasibleTop: Trial): Trial {
  const bottom = worstFor(minMassRatio);
  if (bottom.value <= limit) return bottom;
  return illinois(worstFor, limit, bottom, feasibleTop);
}

/** Brackets the answer around a guess by widening steps of 2 %, 4 %, 8 % …, then polishes it. */
function refineNear(
  worstFor: (mu: number) => Trial,
  limit: number,
  guessMu: number,
  minMassRatio: number,
  maxMassRatio: number,
  feasibleTop: Trial,
): Trial {
  const first = worstFor(Math.min(Math.max(guessMu, minMassRatio), maxMassRatio));
  let lo: Trial | null = null;
  let hi: Trial | null = null;
  if (first.value <= limit) hi = first;
  else lo = first;
  let step = 0.02;
  while (!lo || !hi) {
    if (hi && !lo) {
      const mu = hi.mu / (1 + step);
      if (mu <= minMassRatio) {
        const bottom = worstFor(minMassRatio);
        if (bottom.value <= limit) return bottom;
        lo = bottom;
        break;
      }
      const t = worstFor(mu);
      if (t.value <= limit) hi = t;
      else lo = t;
    } else if (lo && !hi) {
      const mu = lo.mu * (1 + step);
      if (mu >= maxMassRatio) {
        hi = feasibleTop;
        break;
      }
      const t = worstFor(mu);
      if (t.value <= limit) hi = t;
      else lo = t;
    }
    step *= 2;
  }
  return illinois(worstFor, limit, lo as Trial, hi as Trial);
}

export function sizeDamper(input: SizeInput): SizeResult {
  const { structure, method, loadCase } = input;
  const limitMPerS2 = input.peakAccelerationLimitMPerS2;
  const toleranceRatio = input.structureFrequencyToleranceRatio ?? 0;
  const maxMassRatio = input.maxMassRatio ?? 0.25;
  const minMassRatio = 1e-4;
  if (!(limitMPerS2 > 0)) throw new LoadCaseError('peakAccelerationLimitMPerS2', 'peakAccelerationLimitMPerS2 must be greater than 0');
  if (!(toleranceRatio >= 0 && toleranceRatio < 1)) throw new LoadCaseError('structureFrequencyToleranceRatio', 'structureFrequencyToleranceRatio must be in [0, 1)');
  const envelope = buildLoadEnvelope(structure, loadCase);
  const nominalFrequencyHz = structure.frequencyHz;
  const rangeHz: [number, number] = [nominalFrequencyHz * (1 - toleranceRatio), nominalFrequencyHz * (1 + toleranceRatio)];
  const modalMassKg = structure.modalMassKg;
  const zs = structure.dampingRatio;
  const warnings: DesignWarning[] = [];
  warnings.push(...frequencyRangeWarnings(nominalFrequencyHz, envelope), ...envelope.warnings);
  if (toleranceRatio > 0 && (rangeHz[0] < envelope.structureFrequencyRangeHz[0] || rangeHz[1] > envelope.structureFrequencyRangeHz[1])) {
    warnings.push({
      code: 'tolerance-outside-load-model',
      message: `part of the structure-frequency band ${rangeHz[0].toPrecision(4)}–${rangeHz[1].toPrecision(4)} Hz lies outside the ${envelope.kind} load model's ${envelope.structureFrequencyRangeHz[0]}–${envelope.structureFrequencyRangeHz[1]} Hz`,
    });
  }
  let evaluations = 0;
  // ζ = 0: the bare mode is unbounded wherever a structure frequency of the band meets a loaded frequency.
  const bareUnboundedHz = zs === 0 ? unboundedBareFrequencyHz(envelope.bands, [nominalFrequencyHz, nominalFrequencyHz]) ?? unboundedBareFrequencyHz(envelope.bands, rangeHz) : null;
  const bare =
    bareUnboundedHz === null
      ? worstPeakOverStructureFrequencies(structure, [], envelope.bands, rangeHz)
      : { value: Infinity, structureFrequencyHz: bareUnboundedHz };
  if (bareUnboundedHz !== null) warnings.push(bareUnboundedWarning(bareUnboundedHz));
  const worstWith = (tuning: TuningMethod) => (mu: number): Trial => {
    evaluations++;
    const ratios = tuningRatios(tuning, mu, zs);
    if (zs === 0 && !(ratios.tmdDampingRatio > 0)) {
      throw new LoadCaseError(
        'method',
        `${tuning} gives the damper a damping ratio of 0 at a mass ratio of ${mu.toPrecision(3)} and the structure has none: the steady-state response of the undamped system is unbounded at its resonances`,
      );
    }
    const tmd = { massKg: mu * modalMassKg, frequencyHz: ratios.frequencyRatio * nominalFrequencyHz, dampingRatio: ratios.tmdDampingRatio };
    return { mu, tmd, ...worstPeakOverStructureFrequencies(structure, [tmd], envelope.bands, rangeHz) };
  };
  const base = {
    structureFrequencyRangeHz: rangeHz,
    peakAccelerationLimitMPerS2: limitMPerS2,
    method,
    bareStructureWorstPeakAccelerationMPerS2: Number.isFinite(bare.value) ? bare.value : null,
    caution: designCaution,
  };
  if (bare.value <= limitMPerS2) {
    warnings.push({ code: 'no-damper-needed', message: 'the bare structure already meets the limit over the whole structure-frequency band' });
    return {
      ...base, massRatio: 0, tmd: null, worstPeakAccelerationMPerS2: bare.value, worstAtStructureFrequencyHz: bare.structureFrequencyHz,
      tmdStrokeM: null, hardware: null, evaluations, warnings,
    };
  }
  const worstFor = worstWith(method);
  const top = worstFor(maxMassRatio);
  if (top.value > limitMPerS2) {
    throw new LoadCaseError(
      'peakAccelerationLimitMPerS2',
      `no damper up to a mass ratio of ${(100 * maxMassRatio).toFixed(1)} % keeps the worst peak (${top.value.toPrecision(4)} m/s² at that mass ratio) within ${limitMPerS2} m/s²`,
    );
  }
  let found: Trial;
  const proxy = proxyMethods[method];
  if (proxy) {
    // The numerical optimum costs a search per trial: locate the answer with the closed-form tuning that is its
    // close relative, then bracket and polish with the method itself.
    const worstProxy = worstWith(proxy);
    const proxyTop = worstProxy(maxMassRatio);
    const guess = proxyTop.value > limitMPerS2 ? top : findMassRatio(worstProxy, limitMPerS2, minMassRatio, proxyTop);
    found = refineNear(worstFor, limitMPerS2, guess.mu, minMassRatio, maxMassRatio, top);
  } else {
    found = findMassRatio(worstFor, limitMPerS2, minMassRatio, top);
  }
  warnings.push(...massRatioWarnings(found.mu));
  // Stroke of the chosen damper: its worst over the load band and the structure-frequency band.
  const tmd = found.tmd;
  const strokeM = worstPeakOverStructureFrequencies(structure, [tmd], envelope.bands, rangeHz, 'tmdStroke').value;
  const hardware = buildHardwareEntry(tmd, strokeM, input.hardware);
  if (hardware.strokeWithinLimit === false) {
    warnings.push({
      code: 'stroke-beyond-travel',
      message: `the design stroke ${(1000 * hardware.designStrokeM).toFixed(1)} mm (×${hardware.strokeMarginFactor} margin) exceeds the hardware travel ${(1000 * (hardware.strokeLimitM as number)).toFixed(1)} mm`,
    });
  }
  return {
    tmdStrokeM: strokeM,
    hardware,
    ...base,
    massRatio: found.mu,
    tmd: found.tmd,
    worstPeakAccelerationMPerS2: found.value,
    worstAtStructureFrequencyHz: found.structureFrequencyHz,
    evaluations,
    warnings,
  };
}
