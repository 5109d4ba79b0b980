/**
 * `assess`: a structure mode with its dampers under a pedestrian load case, against comfort criteria.
 * Peak accelerations with the dampers and for the bare structure are continuous maxima of the load envelope
 * (see loads/response-envelope.ts); each damper's maximum stroke is the same envelope of its relative
 * displacement; the verdict compares the peak with the chosen limit and names the set and the limit.
 */

import type { ModeDirection, StructureMode, TmdParameters } from './types';
import type { AssessResponse, DesignWarning } from '../contracts/compute-design';
import { buildLoadEnvelope, LoadCaseError, type LoadEnvelope, type SteadyLoadCase } from './loads/load-envelope';
import { createModeTmdSystem, type ModeTmdSystem } from './response';
import { findEnvelopePeak, unboundedBareFrequencyHz, unboundedResonanceHz, type ForceBand } from './loads/response-envelope';
import { criticalPedestrians, criticalPedestriansBare } from './loads/lateral-lock-in';
import { dg11PeakAccelerationMPerS2 } from './loads/floor-walking';
import { gradeComfort, resolveComfortLimit, type ComfortLimit, type CriteriaInput } from './criteria';
import { buildHardwareEntry, type HardwareOptions, type HardwareSheetEntry } from './hardware';
import { simulateMovingWalker, type MovingWalkerInput } from './moving-walker';

export interface DesignStructure extends StructureMode {
  direction: ModeDirection;
}

export type DesignLoadCase = SteadyLoadCase | ({ kind: 'moving-walker' } & MovingWalkerInput);

export type { DesignWarning };

export interface AssessInput {
  structure: DesignStructure;
  tmds: readonly TmdParameters[];
  loadCase: DesignLoadCase;
  criteria?: CriteriaInput;
  hardware?: HardwareOptions;
}

export const designCaution =
  'Results support, and never replace, the judgement of a qualified engineer, who remains responsible for the design. ' +
  'The load models and limits are those of the named guide or code; the project specification, local codes and licensed practice govern.';

/** Mass ratio bounds outside which a warning is raised (PRODUCT: 0.5–10 %). */
export const massRatioWarningRange = [0.005, 0.1] as const;

export function massRatioWarnings(massRatio: number): DesignWarning[] {
  if (massRatio > 0 && (massRatio < massRatioWarningRange[0] || massRatio > massRatioWarningRange[1])) {
    return [{
      code: 'mass-ratio-outside-range',
      message: `the mass ratio ${(100 * massRatio).toFixed(2)} % is outside the usual 0.5–10 % range of tuned mass dampers`,
    }];
  }
  return [];
}

export function frequencyRangeWarnings(structureFrequencyHz: number, envelope: { kind: string; structureFrequencyRangeHz: readonly [number, number] }): DesignWarning[] {
  const [lo, hi] = envelope.structureFrequencyRangeHz;
  if (structureFrequencyHz < lo || structureFrequencyHz > hi) {
    return [{
      code: 'structure-frequency-outside-load-model',
      message: `the structure frequency ${structureFrequencyHz.toPrecision(4)} Hz is outside ${lo}–${hi} Hz, the range the ${envelope.kind} load model covers`,
    }];
  }
  return [];
}

/** The warning given with `bareStructure…: null`: the undamped bare mode resonates inside the loaded band. */
export function bareUnboundedWarning(structureFrequencyHz: number, what = 'the bare structure'): DesignWarning {
  return {
    code: 'bare-structure-unbounded',
    message: `${what} has a damping ratio of 0 and its frequency ${structureFrequencyHz.toPrecision(4)} Hz lies in the loaded band: its steady-state resonance grows without limit, so no finite peak exists and the bare value is given as null (the verdict without dampers is fail)`,
  };
}

/**
 * Refuses a system with no damping anywhere whose resonance lies in the loaded band (the steady state is unbounded).
 * `dampingPath` names the field that removed the last damping (a damper's damping ratio, a damping factor …).
 */
export function refuseUnboundedResponse(system: ModeTmdSystem, bands: readonly ForceBand[], dampingPath: string, how: string): void {
  const hit = unboundedResonanceHz(system, bands);
  if (!hit) return;
  const f = hit.frequencyHz.toPrecision(4);
  const band = `${hit.band.loHz}–${hit.band.hiHz} Hz`;
  if (system.tmdCount === 0) {
    throw new LoadCaseError(
      'structure.dampingRatio',
      `is 0 and no damper is attached: the structure frequency ${f} Hz lies in the loaded band ${band}, where the steady-state response is unbounded; give a damping ratio greater than 0 or attach a damper`,
    );
  }
  throw new LoadCaseError(
    dampingPath,
    `${how}: the coupled natural frequency ${f} Hz lies in the loaded band ${band}, where the steady-state response of the undamped system is unbounded; give at least one damper a damping ratio greater than 0`,
  );
}

interface CriterionAnswer {
  verdict: 'pass' | 'fail';
  utilisation: number;
  bareStructureVerdict: 'pass' | 'fail';
  /** null when the bare peak is unbounded (ζ = 0 with the structure frequency in the loaded band). */
  bareStructureUtilisation: number | null;
  criterion: {
    set: string; class: string; label: string; source: string; limitMPerS2: number; atFrequencyHz: number; caution: string;
  };
  comfortClass?: string;
  bareStructureComfortClass?: string;
}

function utilisationOf(
  limit: ComfortLimit,
  system: ModeTmdSystem,
  envelope: LoadEnvelope | null,
  peak: { value: number; frequencyHz: number },
): { utilisation: number; atFrequencyHz: number } {
  if (!limit.frequencyDependent || !envelope) {
    return { utilisation: peak.value / limit.limitMPerS2(peak.frequencyHz), atFrequencyHz: peak.frequencyHz };
  }
  // The limit depends on frequency: the governing point is the maximum of a(f) / a_limit(f), not the peak of a.
  const worst = findEnvelopePeak(system, envelope.bands, 'structureAcceleration', { divisor: limit.limitMPerS2 });
  return { utilisation: worst.value, atFrequencyHz: worst.frequencyHz };
}

function evaluateCriterion(
  criteria: CriteriaInput,
  direction: ModeDirection,
  structureFrequencyHz: number,
  withDampers: { system: ModeTmdSystem; peak: { value: number; frequencyHz: number } },
  bare: { system: ModeTmdSystem; peak: { value: number | null; frequencyHz: number } },
  envelope: LoadEnvelope | null,
  warnings: DesignWarning[],
): CriterionAnswer {
  let limit: ComfortLimit;
  try {
    limit = resolveComfortLimit(criteria, direction);
  } catch (error) {
    throw new LoadCaseError('criteria.set', (error as Error).message);
  }
  const w = utilisationOf(limit, withDampers.system, envelope, withDampers.peak);
  const barePeak = bare.peak.value;
  const b = barePeak === null ? null : utilisationOf(limit, bare.system, envelope, { value: barePeak, frequencyHz: bare.peak.frequencyHz });
  if (limit.applicableRangeHz && (structureFrequencyHz < limit.applicableRangeHz[0] || structureFrequencyHz > limit.applicableRangeHz[1])) {
    warnings.push({
      code: 'structure-frequency-outside-criteria',
      message: `${limit.source} asks for this check for structure frequencies in ${limit.applicableRangeHz[0]}–${limit.applicableRangeHz[1]} Hz; the structure is at ${structureFrequencyHz.toPrecision(4)} Hz`,
    });
  }
  const answer: CriterionAnswer = {
    verdict: w.utilisation <= 1 ? 'pass' : 'fail',
    utilisation: w.utilisation,
    bareStructureVerdict: b !== null && b.utilisation <= 1 ? 'pass' : 'fail',
    bareStructureUtilisation: b === null ? null : b.utilisation,
    criterion: {
      set: limit.set,
      class: limit.class,
      label: limit.label,
      source: limit.source,
      limitMPerS2: limit.limitMPerS2(w.atFrequencyHz),
      atFrequencyHz: w.atFrequencyHz,
      caution: limit.caution,
    },
  };
  if (limit.set === 'setra' || limit.set === 'hivoss') {
    answer.comfortClass = gradeComfort(limit.set, direction, withDampers.peak.value);
    answer.bareStructureComfortClass = gradeComfort(limit.set, direction, barePeak ?? Infinity);
  }
  return answer;
}

/** The answer of `assess`: the type of its contract (compute-design.ts), not a copy of it. */
export type AssessResult = AssessResponse;

function strokeWarnings(hardware: readonly HardwareSheetEntry[]): DesignWarning[] {
  const out: DesignWarning[] = [];
  hardware.forEach((h, j) => {
    if (h.strokeWithinLimit === false) {
      out.push({
        code: 'stroke-beyond-travel',
        message: `damper ${j + 1}: the design stroke ${(1000 * h.designStrokeM).toFixed(1)} mm (×${h.strokeMarginFactor} margin) exceeds the hardware travel ${(1000 * (h.strokeLimitM as number)).toFixed(1)} mm`,
      });
    }
  });
  return out;
}

export function assessDesign(input: AssessInput): AssessResult {
  const { structure, tmds, loadCase } = input;
  const system = createModeTmdSystem(structure, tmds);
  const bareSystem = createModeTmdSystem(structure, []);
  const totalTmdMassKg = tmds.reduce((s, t) => s + t.massKg, 0);
  const massRatio = totalTmdMassKg / structure.modalMassKg;
  const warnings: DesignWarning[] = [...massRatioWarnings(massRatio)];

  if (loadCase.kind === 'moving-walker') {
    const history = simulateMovingWalker(structure, tmds, loadCase);
    const bareHistory = simulateMovingWalker(structure, [], loadCase);
    const range = history.modelRangeHz;
    const fp = history.governingHarmonicFrequencyHz;
    warnings.push(...frequencyRangeWarnings(structure.frequencyHz, { kind: 'moving walker', structureFrequencyRangeHz: range }));
    if (history.steadyStatePeakAccelerationMPerS2 === null) {
      warnings.push({
        code: 'steady-state-unbounded',
        message: `the system has no damping and the governing harmonic at ${fp.toPrecision(4)} Hz is at one of its natural frequencies: its steady state grows without limit (timeHistory.steadyStatePeakAccelerationMPerS2 is null); the response to one crossing is finite and is the one reported`,
      });
    }
    const result: AssessResult = {
      peakAccelerationMPerS2: history.peakAccelerationMPerS2,
      atFrequencyHz: fp,
      bareStructurePeakAccelerationMPerS2: bareHistory.peakAccelerationMPerS2,
      bareStructureAtFrequencyHz: fp,
      tmdStrokeM: history.maxTmdStrokeM,
      tmdStrokeAtFrequencyHz: tmds.map(() => fp),
      modalForceAmplitudeN: history.governingHarmonicForceN,
      massRatio,
      loadModel: {
        kind: 'moving-walker',
        source: 'Bachmann & Ammann (1987) dynamic load factors, force moving along the half-sine mode of a simply supported span, Newmark average acceleration',
        bandsHz: [[fp, fp]],
        structureFrequencyRangeHz: range,
      },
      timeHistory: {
        ...history,
        bareStructurePeakAccelerationMPerS2: bareHistory.peakAccelerationMPerS2,
        bareStructureMaxRunningRms1sMPerS2: bareHistory.maxRunningRms1sMPerS2,
      },
      hardware: [],
      warnings,
      caution: designCaution,
    };
    return attachStrokesAndCriteria(result, input, system, bareSystem, null, warnings);
  }

  const envelope = buildLoadEnvelope(structure, loadCase);
  refuseUnboundedResponse(system, envelope.bands, 'tmds.0.dampingRatio', 'is 0, as are the damping ratios of the structure and of every other damper');
  const peak = findEnvelopePeak(system, envelope.bands);
  // ζ = 0: the bare mode's resonance is unbounded if its frequency lies in a band where the force is not 0.
  const bareUnbounded =
    structure.dampingRatio === 0 && unboundedBareFrequencyHz(envelope.bands, [structure.frequencyHz, structure.frequencyHz]) !== null;
  const barePeak = bareUnbounded
    ? { value: null, frequencyHz: structure.frequencyHz }
    : findEnvelopePeak(bareSystem, envelope.bands);
  if (!Number.isFinite(peak.value) || (barePeak.value !== null && !Number.isFinite(barePeak.value))) {
    throw new LoadCaseError('structure.dampingRatio', 'the response is unbounded: the system has no damping at a resonance inside the load band');
  }
  warnings.push(...frequencyRangeWarnings(structure.frequencyHz, envelope), ...envelope.warnings);
  if (bareUnbounded) warnings.push(bareUnboundedWarning(structure.frequencyHz));
  const result: AssessResult = {
    peakAccelerationMPerS2: peak.value,
    atFrequencyHz: peak.frequencyHz,
    bareStructurePeakAccelerationMPerS2: barePeak.value,
    bareStructureAtFrequencyHz: barePeak.frequencyHz,
    tmdStrokeM: [],
    tmdStrokeAtFrequencyHz: [],
    modalForceAmplitudeN: peak.forceN,
    massRatio,
    loadModel: {
      kind: envelope.kind,
      source: envelope.source,
      bandsHz: envelope.bands.map((b) => [b.loHz, b.hiHz] as [number, number]),
      structureFrequencyRangeHz: envelope.structureFrequencyRangeHz,
    },
    hardware: [],
    warnings,
    caution: designCaution,
  };
  if (envelope.equivalentPedestrians !== undefined) {
    result.equivalentPedestrians = envelope.equivalentPedestrians;
    result.pedestrianCount = envelope.pedestrianCount;
  }
  if (envelope.lockInCoefficientNsPerM !== undefined) {
    const k = envelope.lockInCoefficientNsPerM;
    const critical = criticalPedestrians(structure, tmds, k);
    const expected = envelope.pedestrianCount ?? 0;
    result.lockIn = {
      coefficientNsPerM: k,
      expectedPedestrians: expected,
      criticalPedestrians: critical,
      bareStructureCriticalPedestrians: criticalPedestriansBare(structure, k),
      lockInExpected: expected >= critical,
      source: 'Dallard et al., "The London Millennium Footbridge", The Structural Engineer 79(22), 2001: N_L = 8π ζ f M / k',
    };
    if (structure.dampingRatio === 0) {
      warnings.push({
        code: 'lock-in-undamped-structure',
        message:
          'the structure has a damping ratio of 0, so its critical number of pedestrians for lateral lock-in N_L = 8π ζ f M / k is 0: any crowd can lock in' +
          (tmds.length ? `; with the dampers the critical number is ${critical.toFixed(0)}` : ''),
      });
    }
    if (result.lockIn.lockInExpected) {
      warnings.push({
        code: 'lateral-lock-in',
        message: `${expected.toFixed(0)} pedestrians expected on the deck reach the critical number ${critical.toFixed(0)} for lateral lock-in`,
      });
    }
  }
  if (envelope.dg11) {
    // a_p/g = P0 e^(−0.35 f_n)/(β W) divides by β: with β = 0 the formula has no value.
    const formula =
      structure.dampingRatio > 0
        ? dg11PeakAccelerationMPerS2(envelope.dg11.constantForceN, structure.frequencyHz, structure.dampingRatio, envelope.dg11.effectiveWeightN)
        : null;
    result.dg11 = { ...envelope.dg11, formulaPeakAccelerationMPerS2: formula };
    if (formula === null) {
      warnings.push({
        code: 'dg11-formula-undamped',
        message: 'the DG11 formula a_p/g = P0 e^(−0.35 f_n)/(β W) divides by the damping ratio β, which is 0: it gives no value (dg11.formulaPeakAccelerationMPerS2 is null)',
      });
    }
  }
  return attachStrokesAndCriteria(result, input, system, bareSystem, envelope, warnings);
}

function attachStrokesAndCriteria(
  result: AssessResult,
  input: AssessInput,
  system: ModeTmdSystem,
  bareSystem: ModeTmdSystem,
  envelope: LoadEnvelope | null,
  warnings: DesignWarning[],
): AssessResult {
  const { structure, tmds } = input;
  if (envelope) {
    result.tmdStrokeM = [];
    result.tmdStrokeAtFrequencyHz = [];
    tmds.forEach((_, j) => {
      const stroke = findEnvelopePeak(system, envelope.bands, 'tmdStroke', { tmdIndex: j });
      result.tmdStrokeM.push(stroke.value);
      result.tmdStrokeAtFrequencyHz.push(stroke.frequencyHz);
    });
  }
  result.hardware = tmds.map((t, j) => buildHardwareEntry(t, result.tmdStrokeM[j] ?? 0, input.hardware));
  warnings.push(...strokeWarnings(result.hardware));
  if (input.criteria) {
    const c = evaluateCriterion(
      input.criteria,
      structure.direction,
      structure.frequencyHz,
      { system, peak: { value: result.peakAccelerationMPerS2, frequencyHz: result.atFrequencyHz } },
      { system: bareSystem, peak: { value: result.bareStructurePeakAccelerationMPerS2, frequencyHz: result.bareStructureAtFrequencyHz } },
      envelope,
      warnings,
    );
    Object.assign(result, c);
  }
  return result;
}
