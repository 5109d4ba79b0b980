/**
 * Turns a steady-state load case into force-frequency bands with the modal force amplitude F(f) at each force
 * frequency. The response is the envelope: the continuous maximum over every band of |response per N| × F(f).
 *  - harmonic: F constant over the pacing range;
 *  - walker / jogger: each harmonic h of the Bachmann & Ammann set over h × pacing range, F = α_h G |φ|;
 *  - crowd / lateral: one band where the guide's ψ(f) > 0, F = P ψ(f) n' mean(|φ|), n' from the structure's own
 *    damping ratio (the dampers' added damping is not credited in n': the guides tie n' to the bare structure);
 *  - floor-walking: DG11's force P0 e^(−0.35 f) over the bands of the walking harmonics i × (1.6 … 2.2 Hz).
 */

import type { LoadDirection, CrowdGuide } from './pedestrian-crowd';
import {
  crowdModalForceN,
  equivalentPedestrianCount,
  evaluatePsi,
  findTrafficClass,
  halfSineModeShapeMean,
  psiCurves,
} from './pedestrian-crowd';
import { bachmannAmmannBodyWeightN, findGaitLoadModel, harmonicBandHz, type Gait } from './walking-harmonics';
import {
  dg11ConstantForceN,
  dg11ForceAmplitudeN,
  dg11ForceBandsHz,
  dg11HarmonicCount,
  dg11MaximumFrequencyHz,
  dg11StepFrequencyRangeHz,
  standardGravityMPerS2,
} from './floor-walking';
import { dallardLateralCoefficientNsPerM } from './lateral-lock-in';
import type { ForceBand } from './response-envelope';

export interface EnvelopeStructure {
  modalMassKg: number;
  frequencyHz: number;
  dampingRatio: number;
  direction: LoadDirection;
}

type Band = readonly [number, number];

export type SteadyLoadCase =
  | { kind: 'harmonic'; modalForceAmplitudeN: number; pacingRangeHz: Band }
  | { kind: 'walker' | 'jogger'; pacingRangeHz?: Band; bodyWeightN?: number; modeShapeValue?: number }
  | {
      kind: 'crowd' | 'lateral';
      guide: CrowdGuide;
      densityPerM2?: number;
      trafficClass?: string;
      deckAreaM2: number;
      modeShapeMean?: number;
      lockInCoefficientNsPerM?: number;
    }
  | { kind: 'floor-walking'; constantForceN?: number; stepFrequencyRangeHz?: Band; harmonicCount?: number; effectiveWeightN?: number };

export interface LoadEnvelope {
  kind: SteadyLoadCase['kind'];
  source: string;
  bands: ForceBand[];
  /** Structure frequencies the load model covers (a warning outside). */
  structureFrequencyRangeHz: [number, number];
  equivalentPedestrians?: number;
  pedestrianCount?: number;
  densityPerM2?: number;
  lockInCoefficientNsPerM?: number;
  dg11?: { effectiveWeightN: number; constantForceN: number };
}

/** Thrown where the load case does not fit the structure (the message names the field). */
export class LoadCaseError extends RangeError {
  constructor(readonly path: string, message: string) {
    super(message);
    this.name = 'LoadCaseError';
  }
}

const crowdSources: Record<CrowdGuide, string> = {
  setra: 'Sétra/AFGC footbridge guide (2006): n\' = 10.8 √(ζ n) or 1.85 √n, first-harmonic force 280/140/35 N, Sétra ψ(f)',
  hivoss: 'HiVoSS footbridge guideline (2008): n\' = 10.8 √(ζ n) or 1.85 √n, first-harmonic force 280/140/35 N, HiVoSS ψ(f)',
};

export function buildLoadEnvelope(structure: EnvelopeStructure, loadCase: SteadyLoadCase): LoadEnvelope {
  switch (loadCase.kind) {
    case 'harmonic': {
      const [lo, hi] = loadCase.pacingRangeHz;
      const force = loadCase.modalForceAmplitudeN;
      return {
        kind: 'harmonic',
        source: 'modal force amplitude given by the engineer, envelope over the pacing range',
        bands: [{ loHz: lo, hiHz: hi, forceN: () => force, label: 'harmonic force' }],
        structureFrequencyRangeHz: [lo, hi],
      };
    }
    case 'walker':
    case 'jogger': {
      const gait: Gait = loadCase.kind === 'walker' ? 'walking' : 'jogging';
      const model = findGaitLoadModel(gait, structure.direction);
      if (!model) {
        throw new LoadCaseError('structure.direction', `the Bachmann & Ammann set gives no ${gait} force in the ${structure.direction} direction`);
      }
      const range = loadCase.pacingRangeHz ?? model.pacingRangeHz;
      const weight = loadCase.bodyWeightN ?? bachmannAmmannBodyWeightN;
      const phi = loadCase.modeShapeValue ?? 1;
      const bands: ForceBand[] = model.harmonics.map((h) => {
        const [lo, hi] = harmonicBandHz(h, range);
        const force = h.dynamicLoadFactor * weight * phi;
        return { loHz: lo, hiHz: hi, forceN: () => force, label: `${gait} harmonic ×${h.frequencyMultiple} (α = ${h.dynamicLoadFactor})` };
      });
      const lo = Math.min(...bands.map((b) => b.loHz));
      const hi = Math.max(...bands.map((b) => b.hiHz));
      return {
        kind: loadCase.kind,
        source: `Bachmann & Ammann (1987) dynamic load factors for ${gait}, G = ${weight} N, pacing ${range[0]}–${range[1]} Hz`,
        bands,
        structureFrequencyRangeHz: [lo, hi],
      };
    }
    case 'crowd':
    case 'lateral': {
      const guide = loadCase.guide;
      let density = loadCase.densityPerM2;
      let count: number;
      if (loadCase.trafficClass !== undefined) {
        const cls = findTrafficClass(guide, loadCase.trafficClass);
        if (!cls) throw new LoadCaseError('loadCase.trafficClass', `unknown traffic class ${loadCase.trafficClass} for guide ${guide}`);
        if (cls.personCount !== undefined) {
          count = cls.personCount;
          density = count / loadCase.deckAreaM2;
        } else {
          density = cls.densityPerM2 as number;
          count = density * loadCase.deckAreaM2;
        }
      } else {
        if (density === undefined) throw new LoadCaseError('loadCase.densityPerM2', 'give densityPerM2 or trafficClass');
        count = density * loadCase.deckAreaM2;
      }
      if (density < 1 && structure.dampingRatio === 0) {
        // Sétra 2006 / HiVoSS 2008: below 1 person/m² the equivalent number n' = 10.8 √(ζ n) is built on the
        // structure's own damping ratio; with ζ = 0 it would be 0 and the crowd would load nothing.
        throw new LoadCaseError(
          'structure.dampingRatio',
          `must be greater than 0 for a crowd below 1 person/m² (here ${density.toPrecision(3)} P/m²): the equivalent number of pedestrians n' = 10.8 √(ζ n) of the ${guide === 'setra' ? 'Sétra' : 'HiVoSS'} guide needs the structure's own damping ratio ζ, and ζ = 0 would make it 0; from 1 person/m² n' = 1.85 √n does not depend on ζ`,
        );
      }
      const nEq = equivalentPedestrianCount(count, density, structure.dampingRatio);
      const mean = loadCase.modeShapeMean ?? halfSineModeShapeMean;
      const curve = psiCurves[guide][structure.direction];
      const direction = structure.direction;
      // P n' mean|φ|, times ψ(f) at each force frequency (crowdModalForceN, unrolled for the hot loop).
      const amplitudeN = crowdModalForceN(guide, direction, nEq, mean, 0.5 * (curve.oneFromHz + curve.oneToHz));
      return {
        kind: loadCase.kind,
        source: crowdSources[guide],
        bands: [
          {
            loHz: curve.zeroBelowHz,
            hiHz: curve.zeroAboveHz,
            forceN: (f) => amplitudeN * evaluatePsi(curve, f),
            kinksHz: [curve.oneFromHz, curve.oneToHz],
            label: `${guide} crowd, ${direction}`,
          },
        ],
        structureFrequencyRangeHz: [curve.zeroBelowHz, curve.zeroAboveHz],
        equivalentPedestrians: nEq,
        pedestrianCount: count,
        densityPerM2: density,
        lockInCoefficientNsPerM: loadCase.kind === 'lateral' ? loadCase.lockInCoefficientNsPerM ?? dallardLateralCoefficientNsPerM : undefined,
      };
    }
    case 'floor-walking': {
      const p0 = loadCase.constantForceN ?? dg11ConstantForceN.floor;
      const step = loadCase.stepFrequencyRangeHz ?? dg11StepFrequencyRangeHz;
      const bands = dg11ForceBandsHz(step, loadCase.harmonicCount ?? dg11HarmonicCount).map(
        ([lo, hi], i): ForceBand => ({ loHz: lo, hiHz: hi, forceN: (f) => dg11ForceAmplitudeN(p0, f), label: `DG11 walking harmonic ${i + 1}` }),
      );
      return {
        kind: 'floor-walking',
        source: `AISC Design Guide 11 walking criterion, P0 = ${p0} N, force P0 e^(−0.35 f) at the walking harmonics`,
        bands,
        structureFrequencyRangeHz: [3, dg11MaximumFrequencyHz],
        dg11: {
          constantForceN: p0,
          effectiveWeightN: loadCase.effectiveWeightN ?? 2 * standardGravityMPerS2 * structure.modalMassKg,
        },
      };
    }
  }
}
