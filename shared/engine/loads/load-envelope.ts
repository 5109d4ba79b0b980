/**
 * Turns a steady-state load case into force-frequency bands with the modal force amplitude F(f) at each force
 * frequency. The response is the envelope: the continuous maximum over every band of |response per N| × F(f).
 *  - harmonic: F constant over the pacing range;
 *  - walker / jogger: each harmonic h of the Bachmann & Ammann set over h × pacing range, F = α_h G |φ|;
 *  - crowd / lateral: one band where the guide's ψ(f) > 0 for the chosen harmonic (1, or 2: Sétra 2006 case 3 /
 *    HiVoSS 2008 second-harmonic ψ), F = P ψ(f) n' mean(|φ|), n' from the structure's own damping ratio (the
 *    dampers' added damping is not credited in n': the guides tie n' to the bare structure);
 *  - floor-walking: DG11's force P0 e^(−0.35 f) over the bands of the walking harmonics i × (1.6 … 2.2 Hz).
 * A torsional mode is loaded by the vertical pedestrian force on the vertical ordinates of its eccentric mode shape
 * (walker, jogger: |φ| where the person walks, default 1; crowd: the mean |φ| over the loaded deck, which must be
 * given). The lateral case (lock-in) is for lateral modes and DG11's floor walking for vertical ones only.
 * Every envelope lists, in `warnings`, the values it rests on that could not be checked against a published source.
 */

import type { LoadDirection, CrowdGuide, CrowdHarmonic } from './pedestrian-crowd';
import {
  equivalentPedestrianCount,
  evaluatePsi,
  findCrowdHarmonicModel,
  findTrafficClass,
  halfSineModeShapeMean,
  setraSecondHarmonicClasses,
  setraSecondHarmonicMinimumDensityPerM2,
} from './pedestrian-crowd';
import { bachmannAmmannBodyWeightN, findGaitLoadModel, harmonicBandHz, type Gait } from './walking-harmonics';
import {
  dg11ConstantForceN,
  dg11ForceAmplitudeN,
  dg11ForceBandsHz,
  dg11HarmonicCount,
  dg11MaximumFrequencyHz,
  dg11MinimumFrequencyHz,
  dg11StepFrequencyRangeHz,
  standardGravityMPerS2,
} from './floor-walking';
import { dallardCoefficientRangeHz, dallardLateralCoefficientNsPerM } from './lateral-lock-in';
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
      /** Pedestrian force harmonic, 1 (default) or 2. */
      harmonic?: CrowdHarmonic;
    }
  | { kind: 'floor-walking'; constantForceN?: number; stepFrequencyRangeHz?: Band; harmonicCount?: number; effectiveWeightN?: number };

/** A caution attached to a load model: a value it rests on that is not confirmed, or an assumed shape. */
export interface LoadModelWarning {
  code: string;
  message: string;
}

export interface LoadEnvelope {
  kind: SteadyLoadCase['kind'];
  source: string;
  /** Values of the load model that could not be checked against a published source (from memory), in plain words. */
  warnings: LoadModelWarning[];
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

const guideNames: Record<CrowdGuide, string> = { setra: 'Sétra', hivoss: 'HiVoSS' };

const crowdSources: Record<CrowdGuide, Record<CrowdHarmonic, string>> = {
  setra: {
    1: 'Sétra/AFGC footbridge guide (2006): n\' = 10.8 √(ζ n) or 1.85 √n, first-harmonic force 280/140/35 N, Sétra ψ(f) with linear ramps between its breakpoints (read from the guide\'s figure)',
    2: 'Sétra/AFGC footbridge guide (2006), load case 3 (second harmonic, traffic classes II and I): n\' = 10.8 √(ζ n) or 1.85 √n, force 70/35/7 N per person (range 2.6–5 Hz vertical and longitudinal); ψ assumed (from memory)',
  },
  hivoss: {
    1: 'HiVoSS footbridge guideline (2008): n\' = 10.8 √(ζ n) or 1.85 √n, first-harmonic force 280/140/35 N, HiVoSS ψ(f) with linear ramps between its breakpoints',
    2: 'HiVoSS footbridge guideline (2008), second harmonic: n\' = 10.8 √(ζ n) or 1.85 √n, force 280/140 N × ψ(f), ψ plateau 0.25 on 3.4–4.2 Hz with linear ramps to 0 at 2.5 and 4.6 Hz',
  },
};

const notConfirmedCode = 'load-value-from-memory';

/** One warning listing the values of a load model taken from memory. */
function fromMemoryWarning(what: string, values: readonly string[]): LoadModelWarning {
  return {
    code: notConfirmedCode,
    message: `${what}: ${values.join('; ')} could not be checked against the published source (from memory); check them before relying on the verdict`,
  };
}

export function buildLoadEnvelope(structure: EnvelopeStructure, loadCase: SteadyLoadCase): LoadEnvelope {
  switch (loadCase.kind) {
    case 'harmonic': {
      const [lo, hi] = loadCase.pacingRangeHz;
      const force = loadCase.modalForceAmplitudeN;
      return {
        kind: 'harmonic',
        source: 'modal force amplitude given by the engineer, envelope over the pacing range',
        warnings: [],
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
      const torsional = structure.direction === 'torsional'
        ? `; torsional mode: vertical force on the mode shape's vertical ordinate where the person walks (|φ| = ${phi})`
        : '';
      // Values given in the request replace the set's own (and their caution).
      const notConfirmed = model.notConfirmed
        .filter((v) => !(v.about === 'body-weight' && loadCase.bodyWeightN !== undefined) && !(v.about === 'pacing-band' && loadCase.pacingRangeHz))
        .map((v) => v.note);
      return {
        kind: loadCase.kind,
        source: `Bachmann & Ammann (1987) dynamic load factors for ${gait} (${model.direction}: ${model.harmonics.map((h) => h.dynamicLoadFactor).join(' / ')}), G = ${weight} N, pacing ${range[0]}–${range[1]} Hz${torsional}`,
        warnings: notConfirmed.length ? [fromMemoryWarning(`the ${gait} load model`, notConfirmed)] : [],
        bands,
        structureFrequencyRangeHz: [lo, hi],
      };
    }
    case 'crowd':
    case 'lateral': {
      const guide = loadCase.guide;
      const harmonic: CrowdHarmonic = loadCase.harmonic ?? 1;
      const direction = structure.direction;
      if (loadCase.kind === 'lateral' && direction !== 'lateral') {
        // The lock-in check (Dallard et al. 2001) is defined for lateral modes only.
        throw new LoadCaseError('structure.direction', `must be "lateral" for a lateral load case (the lock-in check of Dallard et al. 2001 is defined for lateral modes), got "${direction}"`);
      }
      const model = findCrowdHarmonicModel(guide, harmonic, direction);
      if (!model) {
        throw new LoadCaseError(
          'loadCase.harmonic',
          `the ${guideNames[guide]} guide gives no second-harmonic crowd load for a ${direction} mode (HiVoSS 2008 reduces the second harmonic for vertical and longitudinal forces only); use harmonic 1 or the Sétra guide`,
        );
      }
      if (direction === 'torsional' && loadCase.modeShapeMean === undefined) {
        throw new LoadCaseError(
          'loadCase.modeShapeMean',
          'is required for a torsional mode: give the mean of |φ| over the loaded deck for the mode shape scaled to 1 at the damper (the vertical pedestrian force acts on the vertical ordinates of the twisting deck; for a half-sine twist varying linearly across the width and scaled to 1 at the edge it is 1/π ≈ 0.318)',
        );
      }
      let density = loadCase.densityPerM2;
      let count: number;
      if (loadCase.trafficClass !== undefined) {
        const cls = findTrafficClass(guide, loadCase.trafficClass);
        if (!cls) throw new LoadCaseError('loadCase.trafficClass', `unknown traffic class ${loadCase.trafficClass} for guide ${guide}`);
        if (guide === 'setra' && harmonic === 2 && !(setraSecondHarmonicClasses as readonly string[]).includes(cls.name)) {
          throw new LoadCaseError(
            'loadCase.trafficClass',
            `Sétra 2006 applies its second-harmonic load case 3 to traffic classes II and I only; class ${cls.name} has no second-harmonic check in the guide (use harmonic 1)`,
          );
        }
        if (cls.personCount !== undefined) {
          count = cls.personCount;
          density = count / loadCase.deckAreaM2;
        } else {
          density = cls.densityPerM2 as number;
          count = density * loadCase.deckAreaM2;
        }
      } else {
        if (density === undefined) throw new LoadCaseError('loadCase.densityPerM2', 'give densityPerM2 or trafficClass');
        if (guide === 'setra' && harmonic === 2 && density < setraSecondHarmonicMinimumDensityPerM2) {
          throw new LoadCaseError(
            'loadCase.densityPerM2',
            `must be at least ${setraSecondHarmonicMinimumDensityPerM2} persons/m² for the Sétra second harmonic: Sétra 2006 applies its load case 3 to traffic classes II (0.8 P/m²) and I (1.0 P/m²) only, got ${density}`,
          );
        }
        count = density * loadCase.deckAreaM2;
      }
      if (density < 1 && structure.dampingRatio === 0) {
        // Sétra 2006 / HiVoSS 2008: below 1 person/m² the equivalent number n' = 10.8 √(ζ n) is built on the
        // structure's own damping ratio; with ζ = 0 it would be 0 and the crowd would load nothing.
        throw new LoadCaseError(
          'structure.dampingRatio',
          `must be greater than 0 for a crowd below 1 person/m² (here ${density.toPrecision(3)} P/m²): the equivalent number of pedestrians n' = 10.8 √(ζ n) of the ${guideNames[guide]} guide needs the structure's own damping ratio ζ, and ζ = 0 would make it 0; from 1 person/m² n' = 1.85 √n does not depend on ζ`,
        );
      }
      const nEq = equivalentPedestrianCount(count, density, structure.dampingRatio);
      const mean = loadCase.modeShapeMean ?? halfSineModeShapeMean;
      const curve = model.psi;
      // P n' mean|φ|, times ψ(f) at each force frequency (crowdModalForceN, unrolled for the hot loop).
      const amplitudeN = model.forcePerPersonN * nEq * mean;
      const warnings: LoadModelWarning[] = [];
      if (guide === 'setra' && harmonic === 2) {
        const lateral = model.forceDirection === 'lateral';
        const shape = `linear ramps, 0 at ${curve.zeroBelowHz} Hz, 1 on ${curve.oneFromHz}–${curve.oneToHz} Hz, 0 at ${curve.zeroAboveHz} Hz`;
        warnings.push({
          code: 'psi-shape-assumed',
          message: lateral
            ? `Sétra 2006 load case 3: the force of ${model.forcePerPersonN} N per person is the guide's; the lateral frequency range and the shape of ψ in it are assumed (from memory: ${shape}); check them against the guide before relying on the verdict`
            : `Sétra 2006 load case 3: the force of ${model.forcePerPersonN} N per person and the range 2.6–5 Hz are the guide's; the shape of ψ inside that range is assumed (from memory: ${shape}); check it against the guide before relying on the verdict`,
        });
      }
      const second = harmonic === 1 ? findCrowdHarmonicModel(guide, 2, direction) : undefined;
      if (second && structure.frequencyHz > second.psi.zeroBelowHz && structure.frequencyHz < second.psi.zeroAboveHz) {
        warnings.push({
          code: 'second-harmonic-range',
          message: `the structure frequency ${structure.frequencyHz.toPrecision(4)} Hz lies in the ${guideNames[guide]} second-harmonic range ${second.psi.zeroBelowHz}–${second.psi.zeroAboveHz} Hz, where the first harmonic does not load it: assess the crowd with harmonic 2`,
        });
      }
      if (
        loadCase.kind === 'lateral' &&
        loadCase.lockInCoefficientNsPerM === undefined &&
        (structure.frequencyHz < dallardCoefficientRangeHz[0] || structure.frequencyHz > dallardCoefficientRangeHz[1])
      ) {
        warnings.push({
          code: 'lock-in-coefficient-range',
          message: `the lock-in coefficient k = ${dallardLateralCoefficientNsPerM} N s/m per person is Dallard et al.'s value for lateral modes of ${dallardCoefficientRangeHz[0]}–${dallardCoefficientRangeHz[1]} Hz; at ${structure.frequencyHz.toPrecision(4)} Hz the critical number of pedestrians is an extrapolation (give lockInCoefficientNsPerM if a value for this frequency is known)`,
        });
      }
      if (model.forceDirection === 'longitudinal') {
        warnings.push(fromMemoryWarning(`the ${guideNames[guide]} longitudinal crowd load`, ['the use of the vertical ψ curve for longitudinal modes']));
      }
      const assumedShape =
        guide === 'setra' && harmonic === 2
          ? `: linear ramps, 0 at ${curve.zeroBelowHz} Hz, 1 on ${curve.oneFromHz}–${curve.oneToHz} Hz, 0 at ${curve.zeroAboveHz} Hz`
          : '';
      const torsional = direction === 'torsional' ? `; torsional mode: vertical force on the eccentric mode shape, mean |φ| = ${mean}` : '';
      return {
        kind: loadCase.kind,
        source: `${crowdSources[guide][harmonic]}${assumedShape}${torsional}`,
        warnings,
        bands: [
          {
            loHz: curve.zeroBelowHz,
            hiHz: curve.zeroAboveHz,
            forceN: (f) => amplitudeN * evaluatePsi(curve, f),
            kinksHz: [curve.oneFromHz, curve.oneToHz],
            label: `${guide} crowd, harmonic ${harmonic}, ${direction}`,
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
      if (structure.direction !== 'vertical') {
        throw new LoadCaseError('structure.direction', `must be "vertical" for a floor-walking load case (the AISC Design Guide 11 walking criterion is for vertical floor modes), got "${structure.direction}"`);
      }
      const p0 = loadCase.constantForceN ?? dg11ConstantForceN.floor;
      const step = loadCase.stepFrequencyRangeHz ?? dg11StepFrequencyRangeHz;
      const bands = dg11ForceBandsHz(step, loadCase.harmonicCount ?? dg11HarmonicCount).map(
        ([lo, hi], i): ForceBand => ({ loHz: lo, hiHz: hi, forceN: (f) => dg11ForceAmplitudeN(p0, f), label: `DG11 walking harmonic ${i + 1}` }),
      );
      return {
        kind: 'floor-walking',
        source: `AISC Design Guide 11 walking criterion, P0 = ${p0} N, force P0 e^(−0.35 f) at the walking harmonics`,
        warnings: [fromMemoryWarning('the DG11 walking load', [
          ...(loadCase.stepFrequencyRangeHz ? [] : [`the step-frequency band ${step[0]}–${step[1]} Hz`]),
          ...(loadCase.harmonicCount !== undefined ? [] : [`the ${dg11HarmonicCount} walking harmonics`]),
          `the ${dg11MinimumFrequencyHz} Hz lower end of the floors it covers`,
        ])],
        bands,
        structureFrequencyRangeHz: [dg11MinimumFrequencyHz, dg11MaximumFrequencyHz],
        dg11: {
          constantForceN: p0,
          effectiveWeightN: loadCase.effectiveWeightN ?? 2 * standardGravityMPerS2 * structure.modalMassKg,
        },
      };
    }
  }
}
