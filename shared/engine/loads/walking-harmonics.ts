/**
 * One person walking or jogging: the periodic force as a Fourier series of dynamic load factors (DLF) times the
 * body weight, from ONE published set only:
 *   H. Bachmann & W. Ammann, "Vibrations in Structures Induced by Man and Machines", IABSE Structural
 *   Engineering Documents 3e, 1987 (here `bachmann-ammann`).
 * The set of AISC Design Guide 11 (α_i = 0.5, 0.2, 0.1, 0.05 …) belongs to the floor-walking case and is never
 * mixed with this one.
 *
 * Values and how sure we are of them (the PRODUCT spec's table of checked values):
 *  - walking, vertical α1 = 0.4, α2 = 0.1, α3 = 0.1: confirmed (the values the Sétra 2006 guide quotes, with its
 *    700 N reference pedestrian);
 *  - walking, lateral α½ = 0.039 at half the pacing frequency: confirmed — Bachmann & Ammann's 3.9 % of body
 *    weight, as tabulated by J. H. G. Macdonald, Proc. R. Soc. A 465 (2009),
 *    table 2, next to the 4 % of P. Dallard et al., "The London Millennium
 *    Footbridge", The Structural Engineer 79(22), 2001. (An older value of 0.1 is not the published one.)
 *  - NOT confirmed (from memory): the body weight G = 800 N, the pacing bands 1.6–2.4 Hz (walking) and 2.0–3.5 Hz
 *    (jogging), the longitudinal factors α½ = 0.1, α1 = 0.2 and the jogging factors α = 1.6, 0.7, 0.2. Load cases
 *    that use them carry a warning saying so (`notConfirmed`).
 * A torsional mode is loaded by the vertical force on the mode shape's vertical ordinate where the person walks.
 */

import { forceDirectionOf, type ForceDirection, type LoadDirection } from './pedestrian-crowd';

export type Gait = 'walking' | 'jogging';

/** One harmonic: the force at `frequencyMultiple` × pacing frequency with amplitude `dynamicLoadFactor` × G. */
export interface GaitHarmonic {
  frequencyMultiple: number;
  dynamicLoadFactor: number;
}

export interface GaitLoadModel {
  set: 'bachmann-ammann';
  gait: Gait;
  direction: ForceDirection;
  pacingRangeHz: readonly [number, number];
  harmonics: readonly GaitHarmonic[];
  /** The values of this model that could not be checked against a published source (from memory). */
  notConfirmed: readonly UnconfirmedValue[];
}

/** A value from memory, tagged with what it is so that a value given in the request can replace it. */
export interface UnconfirmedValue {
  about: 'body-weight' | 'pacing-band' | 'load-factors';
  note: string;
}

/** Body weight of the design pedestrian, N (Bachmann & Ammann 1987; from memory, not confirmed). */
export const bachmannAmmannBodyWeightN = 800;

/**
 * Lateral dynamic load factor of walking at half the pacing frequency: 3.9 % of body weight (Bachmann & Ammann, as
 * tabulated in Macdonald, Proc. R. Soc. A 465, 2009, table 2; Dallard et al. 2001 use 4 %). Confirmed.
 */
export const bachmannAmmannLateralLoadFactor = 0.039;

const walkingRangeHz = [1.6, 2.4] as const;
const joggingRangeHz = [2.0, 3.5] as const;

const bodyWeightNote: UnconfirmedValue = { about: 'body-weight', note: 'the body weight G = 800 N (Sétra 2006 takes a 700 N pedestrian)' };
const walkingBandNote: UnconfirmedValue = { about: 'pacing-band', note: 'the walking pacing band 1.6–2.4 Hz' };

const models: readonly GaitLoadModel[] = [
  {
    set: 'bachmann-ammann', gait: 'walking', direction: 'vertical', pacingRangeHz: walkingRangeHz,
    harmonics: [
      { frequencyMultiple: 1, dynamicLoadFactor: 0.4 },
      { frequencyMultiple: 2, dynamicLoadFactor: 0.1 },
      { frequencyMultiple: 3, dynamicLoadFactor: 0.1 },
    ],
    notConfirmed: [bodyWeightNote, walkingBandNote],
  },
  {
    set: 'bachmann-ammann', gait: 'walking', direction: 'lateral', pacingRangeHz: walkingRangeHz,
    harmonics: [{ frequencyMultiple: 0.5, dynamicLoadFactor: bachmannAmmannLateralLoadFactor }],
    notConfirmed: [bodyWeightNote, walkingBandNote],
  },
  {
    set: 'bachmann-ammann', gait: 'walking', direction: 'longitudinal', pacingRangeHz: walkingRangeHz,
    harmonics: [
      { frequencyMultiple: 0.5, dynamicLoadFactor: 0.1 },
      { frequencyMultiple: 1, dynamicLoadFactor: 0.2 },
    ],
    notConfirmed: [
      { about: 'load-factors', note: 'the longitudinal load factors 0.1 (half the pacing frequency) and 0.2' },
      bodyWeightNote,
      walkingBandNote,
    ],
  },
  {
    set: 'bachmann-ammann', gait: 'jogging', direction: 'vertical', pacingRangeHz: joggingRangeHz,
    harmonics: [
      { frequencyMultiple: 1, dynamicLoadFactor: 1.6 },
      { frequencyMultiple: 2, dynamicLoadFactor: 0.7 },
      { frequencyMultiple: 3, dynamicLoadFactor: 0.2 },
    ],
    notConfirmed: [
      { about: 'load-factors', note: 'the jogging load factors 1.6 / 0.7 / 0.2' },
      bodyWeightNote,
      { about: 'pacing-band', note: 'the jogging pacing band 2.0–3.5 Hz' },
    ],
  },
];

/**
 * The load model of a gait and mode direction, or undefined where the set gives none (jogging sideways). A torsional
 * mode gets the vertical model.
 */
export function findGaitLoadModel(gait: Gait, direction: LoadDirection): GaitLoadModel | undefined {
  const force = forceDirectionOf(direction);
  return models.find((m) => m.gait === gait && m.direction === force);
}

/** The band of force frequencies one harmonic covers over a pacing range. */
export function harmonicBandHz(harmonic: GaitHarmonic, pacingRangeHz: readonly [number, number]): [number, number] {
  return [harmonic.frequencyMultiple * pacingRangeHz[0], harmonic.frequencyMultiple * pacingRangeHz[1]];
}
