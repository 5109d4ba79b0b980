/**
 * What a load case follows, in words: the published source the engine names for it, the structure frequencies it
 * covers, and the values it rests on that could not be checked against the source ("from memory"). Read from the
 * engine itself (buildLoadEnvelope), so the page says what the calculation does.
 */
import type { SavedLoadCase } from '../../../../shared/contracts';
import { buildLoadEnvelope, type SteadyLoadCase } from '../../../../shared/engine/loads/load-envelope';
import { findTrafficClass, type CrowdGuide, type LoadDirection } from '../../../../shared/engine/loads/pedestrian-crowd';
import { findGaitLoadModel } from '../../../../shared/engine/loads/walking-harmonics';
import { formatNumber } from '../../../lib/format';

export type LoadCaseSpec = SavedLoadCase['spec'];
export type LoadCaseKind = LoadCaseSpec['kind'];

export const loadCaseKinds: readonly LoadCaseKind[] = ['crowd', 'lateral', 'walker', 'jogger', 'moving-walker', 'floor-walking', 'harmonic'];

export const loadCaseKindLabels: Record<LoadCaseKind, string> = {
  crowd: 'Crowd by density class (Sétra 2006 / HiVoSS 2008)',
  lateral: 'Lateral crowd and lock-in (Sétra 2006 / HiVoSS 2008, Dallard et al. 2001)',
  walker: 'Single walker (Bachmann & Ammann 1987)',
  jogger: 'Single jogger (Bachmann & Ammann 1987)',
  'moving-walker': 'Walker crossing the span, time history (Bachmann & Ammann 1987)',
  'floor-walking': 'Floor walking (AISC Design Guide 11)',
  harmonic: 'Harmonic force given by the engineer',
};

export const loadCaseKindShort: Record<LoadCaseKind, string> = {
  crowd: 'Crowd',
  lateral: 'Lateral crowd',
  walker: 'Walker',
  jogger: 'Jogger',
  'moving-walker': 'Crossing walker',
  'floor-walking': 'Floor walking',
  harmonic: 'Harmonic force',
};

export const guideLabels: Record<CrowdGuide, string> = { setra: 'Sétra 2006', hivoss: 'HiVoSS 2008' };

export interface LoadCaseInfo {
  source: string;
  /** Structure frequencies the load model covers, Hz. */
  rangeHz: readonly [number, number] | null;
  /** The direction of the mode the range is given for. */
  direction: LoadDirection;
  /** Values from memory and other cautions of the engine, in plain words. */
  cautions: string[];
  /** Why no source could be read (an incomplete form), or null. */
  problem: string | null;
}

/** Warnings of the engine that depend on the structure's own frequency, which a load case alone does not know. */
const frequencyDependentWarnings = new Set(['second-harmonic-range', 'lock-in-coefficient-range']);

/** A nominal mode for reading the load model: only its direction matters for the source and the range. */
function nominalMode(direction: LoadDirection) {
  return { modalMassKg: 10_000, frequencyHz: direction === 'lateral' ? 0.9 : 1.9, dampingRatio: 0.005, direction };
}

export function describeLoadCase(spec: LoadCaseSpec): LoadCaseInfo {
  if (spec.kind === 'moving-walker') {
    const gait = spec.gait ?? 'walking';
    const model = findGaitLoadModel(gait, 'vertical');
    const rangeHz = model
      ? ([Math.min(...model.harmonics.map((h) => h.frequencyMultiple * model.pacingRangeHz[0])), Math.max(...model.harmonics.map((h) => h.frequencyMultiple * model.pacingRangeHz[1]))] as const)
      : null;
    return {
      source:
        `One person ${gait === 'walking' ? 'walking' : 'jogging'} across a simply supported span, Bachmann & Ammann (1987) ` +
        `dynamic load factors${model ? ` (${model.harmonics.map((h) => h.dynamicLoadFactor).join(' / ')})` : ''} on the half-sine mode shape, integrated in time (Newmark average acceleration)`,
      rangeHz,
      direction: 'vertical',
      cautions: model?.notConfirmed.length ? [`${model.notConfirmed.join('; ')}: from memory, not confirmed against the published source.`] : [],
      problem: null,
    };
  }
  const direction: LoadDirection = spec.kind === 'lateral' ? 'lateral' : 'vertical';
  try {
    const envelope = buildLoadEnvelope(nominalMode(direction), spec as SteadyLoadCase);
    return {
      source: envelope.source,
      rangeHz: envelope.structureFrequencyRangeHz,
      direction,
      cautions: envelope.warnings.filter((warning) => !frequencyDependentWarnings.has(warning.code)).map((warning) => sentence(warning.message)),
      problem: null,
    };
  } catch (error) {
    return { source: '', rangeHz: null, direction, cautions: [], problem: error instanceof Error ? sentence(error.message) : 'The load case is not complete.' };
  }
}

function sentence(text: string): string {
  const trimmed = text.trim();
  const capital = trimmed.charAt(0).toUpperCase() + trimmed.slice(1);
  return /[.!?]$/.test(capital) ? capital : `${capital}.`;
}

/** The load case's own choices in one line with units. */
export function summariseLoadCase(spec: LoadCaseSpec): string {
  switch (spec.kind) {
    case 'crowd':
    case 'lateral': {
      const cls = spec.trafficClass ? findTrafficClass(spec.guide, spec.trafficClass) : undefined;
      const density = cls
        ? `${spec.guide === 'setra' ? 'class' : ''} ${cls.name} (${cls.personCount !== undefined ? `${cls.personCount} persons` : `${cls.densityPerM2} persons/m²`}, ${cls.description})`.trim()
        : `${formatNumber(spec.densityPerM2 ?? Number.NaN)} persons/m²`;
      return [
        `${guideLabels[spec.guide]}, ${density}`,
        `deck ${formatNumber(spec.deckAreaM2)} m²`,
        spec.modeShapeMean !== undefined ? `mean |φ| ${formatNumber(spec.modeShapeMean, 3)}` : 'mean |φ| 2/π (half sine)',
        spec.harmonic === 2 ? 'second harmonic' : 'first harmonic',
        spec.kind === 'lateral' && spec.lockInCoefficientNsPerM !== undefined ? `lock-in k = ${formatNumber(spec.lockInCoefficientNsPerM)} N·s/m per person` : null,
      ]
        .filter(Boolean)
        .join(' · ');
    }
    case 'walker':
    case 'jogger':
      return [
        spec.pacingRangeHz ? `pacing ${formatNumber(spec.pacingRangeHz[0])}–${formatNumber(spec.pacingRangeHz[1])} Hz` : 'pacing band of the set',
        spec.bodyWeightN !== undefined ? `G = ${formatNumber(spec.bodyWeightN)} N` : 'G = 800 N',
        spec.modeShapeValue !== undefined ? `|φ| ${formatNumber(spec.modeShapeValue, 3)} where the person goes` : '|φ| = 1 (at the antinode)',
      ].join(' · ');
    case 'moving-walker':
      return [
        `span ${formatNumber(spec.spanM)} m`,
        spec.gait === 'jogging' ? 'jogging' : 'walking',
        spec.pacingFrequencyHz !== undefined ? `pacing ${formatNumber(spec.pacingFrequencyHz)} Hz` : 'pacing at resonance',
        spec.walkingSpeedMPerS !== undefined ? `${formatNumber(spec.walkingSpeedMPerS)} m/s` : null,
        spec.bodyWeightN !== undefined ? `G = ${formatNumber(spec.bodyWeightN)} N` : null,
      ]
        .filter(Boolean)
        .join(' · ');
    case 'floor-walking':
      return [
        `P0 = ${formatNumber(spec.constantForceN ?? 290)} N`,
        spec.stepFrequencyRangeHz ? `steps ${formatNumber(spec.stepFrequencyRangeHz[0])}–${formatNumber(spec.stepFrequencyRangeHz[1])} Hz` : 'steps 1.6–2.2 Hz',
        `${spec.harmonicCount ?? 4} harmonics`,
        spec.effectiveWeightN !== undefined ? `W = ${formatNumber(spec.effectiveWeightN)} N` : 'W from the modal mass',
      ].join(' · ');
    case 'harmonic':
      return `modal force ${formatNumber(spec.modalForceAmplitudeN)} N over ${formatNumber(spec.pacingRangeHz[0])}–${formatNumber(spec.pacingRangeHz[1])} Hz`;
  }
}
