/**
 * `assess`: a structure mode with its dampers under a pedestrian load case, against comfort criteria.
 * Peak accelerations with the dampers and for the bare structure are continuous maxima of the load envelope
 * (see loads/response-envelope.ts); each damper's maximum stroke is the same envelope of its relative
 * displacement; the verdict compares the peak with the chosen limit and names the set and the limit.
 */

import type { StructureMode, TmdParameters } from './types';
import type { LoadDirection } from './loads/pedestrian-crowd';
import { buildLoadEnvelope, LoadCaseError, type LoadEnvelope, type SteadyLoadCase } from './loads/load-envelope';
import { createModeTmdKernel, findEnvelopePeak, type ModeTmdKernel } from './loads/response-envelope';
import { criticalPedestrians, criticalPedestriansBare } from './loads/lateral-lock-in';
import { dg11PeakAccelerationMPerS2 } from './loads/floor-walking';
import { gradeComfort, resolveComfortLimit, type ComfortLimit, type CriteriaInput } from './criteria';
import { buildHardwareEntry, type HardwareOptions, type HardwareSheetEntry } from './hardware';
import { simulateMovingWalker, type MovingWalkerInput, type MovingWalkerHistory } from './moving-walker';

export interface DesignStructure extends StructureMode {
  direction: LoadDirection;
}

export type DesignLoadCase = SteadyLoadCase | ({ kind: 'moving-walker' } & MovingWalkerInput);

export interface DesignWarning {
  code: string;
  message: string;
}

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

interface CriterionAnswer {
  verdict: 'pass' | 'fail';
  utilisation: number;
  bareStructureVerdict: 'pass' | 'fail';
  bareStructureUtilisation: number;
  criterion: {
    set: string; class: string; label: string; source: string; limitMPerS2: number; atFrequencyHz: number; caution: string;
  };
  comfortClass?: string;
  bareStructureComfortClass?: string;
}

function utilisationOf(
  limit: ComfortLimit,
  kernel: ModeTmdKernel,
  envelope: LoadEnvelope | null,
  peak: { value: number; frequencyHz: number },
): { utilisation: number; atFrequencyHz: number } {
  if (!limit.frequencyDependent || !envelope) {
    return { utilisation: peak.value / limit.limitMPerS2(peak.frequencyHz), atFrequencyHz: peak.frequencyHz };
  }
  // The limit depends on frequency: the governing point is the maximum of a(f) / a_limit(f), not the peak of a.
  const worst = findEnvelopePeak(kernel, envelope.bands, 'structureAcceleration', { divisor: limit.limitMPerS2 });
  return { utilisation: worst.value, atFrequencyHz: worst.frequencyHz };
}

function evaluateCriterion(
  criteria: CriteriaInput,
  direction: LoadDirection,
  structureFrequencyHz: number,
  withDampers: { kernel: ModeTmdKernel; peak: { value: number; frequencyHz: number } },
  bare: { kernel: ModeTmdKernel; peak: { value: number; frequencyHz: number } },
  envelope: LoadEnvelope | null,
  warnings: DesignWarning[],
): CriterionAnswer {
  let limit: ComfortLimit;
  try {
    limit = resolveComfortLimit(criteria, direction);
  } catch (error) {
    throw new LoadCaseError('criteria.set', (error as Error).message);
  }
  const w = utilisationOf(limit, withDampers.kernel, envelope, withDampers.peak);
  const b = utilisationOf(limit, bare.kernel, envelope, bare.peak);
  if (limit.applicableRangeHz && (structureFrequencyHz < limit.applicableRangeHz[0] || structureFrequencyHz > limit.applicableRangeHz[1])) {
    warnings.push({
      code: 'structure-frequency-outside-criteria',
      message: `${limit.source} asks for this check for structure frequencies in ${limit.applicableRangeHz[0]}–${limit.applicableRangeHz[1]} Hz; the structure is at ${structureFrequencyHz.toPrecision(4)} Hz`,
    });
  }
  const answer: CriterionAnswer = {
    verdict: w.utilisation <= 1 ? 'pass' : 'fail',
    utilisation: w.utilisation,
    bareStructureVerdict: b.utilisation <= 1 ? 'pass' : 'fail',
    bareStructureUtilisation: b.utilisation,
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
    answer.bareStructureComfortClass = gradeComfort(limit.set, direction, bare.peak.value);
  }
  return answer;
}

export interface AssessResult {
  peakAccelerationMPerS2: number;
  atFrequencyHz: number;
  bareStructurePeakAccelerationMPerS2: number;
  bareStructureAtFrequencyHz: number;
  tmdStrokeM: number[];
  tmdStrokeAtFrequencyHz: number[];
  modalForceAmplitudeN: number;
  equivalentPedestrians?: number;
  pedestrianCount?: number;
  massRatio: number;
  verdict?: 'pass' | 'fail';
  utilisation?: number;
  bareStructureVerdict?: 'pass' | 'fail';
  bareStructureUtilisation?: number;
  criterion?: CriterionAnswer['criterion'];
  comfortClass?: string;
  bareStructureComfortClass?: string;
  loadModel: { kind: string; source: string; bandsHz: Array<[number, number]>; structureFrequencyRangeHz: [number, number] };
  lockIn?: {
    coefficientNsPerM: number;
    expectedPedestrians: number;
    criticalPedestrians: number;
    bareStructureCriticalPedestrians: number;
    lockInExpected: boolean;
    source: string;
  };
  dg11?: { effectiveWeightN: number; constantForceN: number; formulaPeakAccelerationMPerS2: number };
  timeHistory?: MovingWalkerHistory & { bareStructurePeakAccelerationMPerS2: number; bareStructureMaxRunningRms1sMPerS2: number };
  hardware: HardwareSheetEntry[];
  warnings: DesignWarning[];
  caution: string;
}

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
  const kernel = createModeTmdKernel(structure, tmds);
  const bareKernel = createModeTmdKernel(structure, []);
  const totalTmdMassKg = tmds.reduce((s, t) => s + t.massKg, 0);
  const massRatio = totalTmdMassKg / structure.modalMassKg;
  const warnings: DesignWarning[] = [...massRatioWarnings(massRatio)];

  if (loadCase.kind === 'moving-walker') {
    const history = simulateMovingWalker(structure, tmds, loadCase);
    const bareHistory = simulateMovingWalker(structure, [], loadCase);
    const range = history.modelRangeHz;
    const fp = history.governingHarmonicFrequencyHz;
    warnings.push(...frequencyRangeWarnings(structure.frequencyHz, { kind: 'moving walker', structureFrequencyRangeHz: range }));
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
    return attachStrokesAndCriteria(result, input, kernel, bareKernel, null, warnings);
  }

  const envelope = buildLoadEnvelope(structure, loadCase);
  const peak = findEnvelopePeak(kernel, envelope.bands);
  const barePeak = findEnvelopePeak(bareKernel, envelope.bands);
  if (!Number.isFinite(peak.value) || !Number.isFinite(barePeak.value)) {
    throw new LoadCaseError('structure.dampingRatio', 'the response is unbounded: the system has no damping at a resonance inside the load band');
  }
  warnings.push(...frequencyRangeWarnings(structure.frequencyHz, envelope));
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
    if (result.lockIn.lockInExpected) {
      warnings.push({
        code: 'lateral-lock-in',
        message: `${expected.toFixed(0)} pedestrians expected on the deck reach the critical number ${critical.toFixed(0)} for lateral lock-in`,
      });
    }
  }
  if (envelope.dg11) {
    result.dg11 = {
      ...envelope.dg11,
      formulaPeakAccelerationMPerS2: dg11PeakAccelerationMPerS2(
        envelope.dg11.constantForceN, structure.frequencyHz, structure.dampingRatio, envelope.dg11.effectiveWeightN,
      ),
    };
  }
  return attachStrokesAndCriteria(result, input, kernel, bareKernel, envelope, warnings);
}

function attachStrokesAndCriteria(
  result: AssessResult,
  input: AssessInput,
  kernel: ModeTmdKernel,
  bareKernel: ModeTmdKernel,
  envelope: LoadEnvelope | null,
  warnings: DesignWarning[],
): AssessResult {
  const { structure, tmds } = input;
  if (envelope) {
    result.tmdStrokeM = [];
    result.tmdStrokeAtFrequencyHz = [];
    tmds.forEach((_, j) => {
      const stroke = findEnvelopePeak(kernel, envelope.bands, 'tmdStroke', { tmdIndex: j });
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
      { kernel, peak: { value: result.peakAccelerationMPerS2, frequencyHz: result.atFrequencyHz } },
      { kernel: bareKernel, peak: { value: result.bareStructurePeakAccelerationMPerS2, frequencyHz: result.bareStructureAtFrequencyHz } },
      envelope,
      warnings,
    );
    Object.assign(result, c);
  }
  return result;
}
