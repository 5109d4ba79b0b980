/**
 * One person walking or jogging: the periodic force as a Fourier series of dynamic load factors (DLF) times the
 * body weight, from ONE published set only:
 *   H. Bachmann & W. Ammann, "Vibrations in Structures Induced by Man and Machines", IABSE Structural
 *   Engineering Documents 3e, 1987 (here `bachmann-ammann`).
 * The set of AISC Design Guide 11 (α_i = 0.5, 0.2, 0.1, 0.05 …) belongs to the floor-walking case and is never
 * mixed with this one.
 *
 * Values (all from memory of Bachmann & Ammann 1987, Table 2.x; the PRODUCT spec lists them as to be checked):
 *  - body weight G = 800 N;
 *  - walking, pacing 1.6–2.4 Hz: vertical α1 = 0.4 (the guide quotes 0.4 at 2.0 Hz rising to 0.5 at 2.4 Hz; the
 *    lower value is used throughout), α2 = 0.1, α3 = 0.1; lateral α1/2 = 0.1 at half the pacing frequency;
 *    longitudinal α1/2 = 0.1, α1 = 0.2;
 *  - running (jogging), pacing 2.0–3.5 Hz: vertical α1 = 1.6, α2 = 0.7, α3 = 0.2.
 */

import type { LoadDirection } from './pedestrian-crowd';

export type Gait = 'walking' | 'jogging';

/** One harmonic: the force at `frequencyMultiple` × pacing frequency with amplitude `dynamicLoadFactor` × G. */
export interface GaitHarmonic {
  frequencyMultiple: number;
  dynamicLoadFactor: number;
}

export interface GaitLoadModel {
  set: 'bachmann-ammann';
  gait: Gait;
  direction: LoadDirection;
  pacingRangeHz: readonly [number, number];
  harmonics: readonly GaitHarmonic[];
}

/** Body weight of the design pedestrian, N (Bachmann & Ammann 1987; from memory). */
export const bachmannAmmannBodyWeightN = 800;

const walkingRangeHz = [1.6, 2.4] as const;
const joggingRangeHz = [2.0, 3.5] as const;

const models: readonly GaitLoadModel[] = [
  {
    set: 'bachmann-ammann', gait: 'walking', direction: 'vertical', pacingRangeHz: walkingRangeHz,
    harmonics: [
      { frequencyMultiple: 1, dynamicLoadFactor: 0.4 },
      { frequencyMultiple: 2, dynamicLoadFactor: 0.1 },
      { frequencyMultiple: 3, dynamicLoadFactor: 0.1 },
    ],
  },
  {
    set: 'bachmann-ammann', gait: 'walking', direction: 'lateral', pacingRangeHz: walkingRangeHz,
    harmonics: [{ frequencyMultiple: 0.5, dynamicLoadFactor: 0.1 }],
  },
  {
    set: 'bachmann-ammann', gait: 'walking', direction: 'longitudinal', pacingRangeHz: walkingRangeHz,
    harmonics: [
      { frequencyMultiple: 0.5, dynamicLoadFactor: 0.1 },
      { frequencyMultiple: 1, dynamicLoadFactor: 0.2 },
    ],
  },
  {
    set: 'bachmann-ammann', gait: 'jogging', direction: 'vertical', pacingRangeHz: joggingRangeHz,
    harmonics: [
      { frequencyMultiple: 1, dynamicLoadFactor: 1.6 },
      { frequencyMultiple: 2, dynamicLoadFactor: 0.7 },
      { frequencyMultiple: 3, dynamicLoadFactor: 0.2 },
    ],
  },
];

/** The load model of a gait and direction, or undefined where the set gives none (jogging sideways). */
export function findGaitLoadModel(gait: Gait, direction: LoadDirection): GaitLoadModel | undefined {
  return models.find((m) => m.gait === gait && m.direction === direction);
}

/** The band of force frequencies one harmonic covers over a pacing range. */
export function harmonicBandHz(harmonic: GaitHarmonic, pacingRangeHz: readonly [number, number]): [number, number] {
  return [harmonic.frequencyMultiple * pacingRangeHz[0], harmonic.frequencyMultiple * pacingRangeHz[1]];
}
