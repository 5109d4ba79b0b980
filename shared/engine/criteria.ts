/**
 * Comfort criteria sets the owner can choose from. Each limit is a peak acceleration (m/s², amplitude of the
 * steady-state harmonic response) and every verdict names the set, the class and the limit used.
 *
 * Sources and how sure we are of them (see docs/engine.md, "Comfort criteria"):
 *  - `setra`: Sétra 2006 comfort ranges 1–3 (maximum, mean, minimum comfort; range 4 unacceptable). Vertical
 *    0.5 / 1.0 / 2.5 m/s², lateral 0.15 / 0.3 / 0.8 m/s² (from memory; the vertical values coincide with HiVoSS).
 *  - `hivoss`: HiVoSS 2008 comfort classes CL1–CL3 (CL4 unacceptable). Vertical 0.5 / 1.0 / 2.5 m/s², lateral
 *    0.1 / 0.3 / 0.8 m/s² (class names seen in an excerpt of the guide; the bands from memory).
 *  - `en1990`: EN 1990:2002/A1:2005 Annex A2, A2.4.3.2 recommended maxima for footbridges: 0.7 m/s² vertical,
 *    0.2 m/s² horizontal in normal use, 0.4 m/s² horizontal under exceptional crowd (seen quoted in a published
 *    summary of footbridge criteria); a comfort check is needed below 5 Hz vertical and 2.5 Hz horizontal.
 *  - `dg11`: AISC Design Guide 11, Table 4-1 walking limits a0/g: offices, residences 0.5 %g; shopping malls
 *    1.5 %g; indoor footbridges 1.5 %g; outdoor footbridges 5 %g (from memory; P0 and the formula seen).
 *  - `iso10137`: ISO 10137:2007 Annex C, multiples R of the base curve (ISO 2631-2 base curve for vertical vibration:
 *    0.005 m/s² r.m.s. from 4 to 8 Hz (seen), 0.01 f^−½ from 1 to 4 Hz and 0.000625 f from 8 to 80 Hz; horizontal
 *    0.00357 m/s² r.m.s. from 1 to 2 Hz and 0.001786 f above (from memory)). Response factors for walking-induced
 *    (intermittent) vibration as used in footfall design: operating theatre 1, hospital ward 2, residential 4,
 *    office 8 (office 8 seen; the others from memory). The peak limit of a harmonic response is √2 R a_base(f).
 */

import type { LoadDirection } from './loads/pedestrian-crowd';
import { standardGravityMPerS2 } from './loads/floor-walking';

export type CriteriaSetName = 'setra' | 'hivoss' | 'en1990' | 'dg11' | 'iso10137' | 'custom';

export interface ComfortLimit {
  set: CriteriaSetName;
  class: string;
  /** Plain-words name of the limit for people who sign it. */
  label: string;
  source: string;
  /** Peak acceleration limit at a frequency, m/s² (constant for every set but ISO 10137). */
  limitMPerS2: (frequencyHz: number) => number;
  frequencyDependent: boolean;
  /** Range of structure frequencies where the set asks for the check (warning outside). */
  applicableRangeHz?: readonly [number, number];
  caution: string;
}

const setraSource = 'Sétra/AFGC technical guide "Footbridges: assessment of vibrational behaviour", 2006, comfort ranges';
const hivossSource = 'HiVoSS "Design of footbridges — Guideline", 2008, comfort classes';
const en1990Source = 'EN 1990 Annex A2 (A2.4.3.2), recommended maximum accelerations for footbridges';
const dg11Source = 'AISC Steel Design Guide 11 (2nd ed., 2016), Table 4-1, walking acceleration limits';
const isoSource = 'ISO 10137:2007 Annex C, multiple of the base curve (response factor R)';

const constant = (value: number) => () => value;

type ComfortTable = Record<string, { vertical: number; horizontal: number; label: string }>;

export const setraComfortRanges: ComfortTable = {
  maximum: { vertical: 0.5, horizontal: 0.15, label: 'maximum comfort (range 1)' },
  mean: { vertical: 1.0, horizontal: 0.3, label: 'mean comfort (range 2)' },
  minimum: { vertical: 2.5, horizontal: 0.8, label: 'minimum comfort (range 3)' },
};

export const hivossComfortClasses: ComfortTable = {
  CL1: { vertical: 0.5, horizontal: 0.1, label: 'CL1 maximum comfort' },
  CL2: { vertical: 1.0, horizontal: 0.3, label: 'CL2 medium comfort' },
  CL3: { vertical: 2.5, horizontal: 0.8, label: 'CL3 minimum comfort' },
};

export const en1990Maxima = {
  'normal-use': { vertical: 0.7, horizontal: 0.2, label: 'normal use' },
  crowd: { vertical: 0.7, horizontal: 0.4, label: 'exceptional crowd conditions' },
} as const;

/** DG11 a0/g limits (fractions of g). */
export const dg11WalkingLimitsG = {
  office: { fractionOfG: 0.005, label: 'offices, residences, quiet spaces (0.5 %g)' },
  'shopping-mall': { fractionOfG: 0.015, label: 'shopping malls (1.5 %g)' },
  'indoor-footbridge': { fractionOfG: 0.015, label: 'indoor footbridges (1.5 %g)' },
  'outdoor-footbridge': { fractionOfG: 0.05, label: 'outdoor footbridges (5 %g)' },
} as const;

export const iso10137ResponseFactors = {
  'operating-theatre': { responseFactor: 1, label: 'hospital operating theatre, critical working area' },
  'hospital-ward': { responseFactor: 2, label: 'hospital ward' },
  residential: { responseFactor: 4, label: 'residential' },
  office: { responseFactor: 8, label: 'office' },
} as const;

/** ISO 2631-2 / ISO 10137 base curve, r.m.s. acceleration in m/s², for the vertical (z) or horizontal (x, y) axis. */
export function iso10137BaseCurveRmsMPerS2(frequencyHz: number, axis: 'vertical' | 'horizontal'): number {
  if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz)) throw new RangeError(`frequencyHz must be > 0, got ${frequencyHz}`);
  const f = Math.min(Math.max(frequencyHz, 1), 80); // the curve is defined from 1 to 80 Hz; held flat outside
  if (axis === 'vertical') {
    if (f < 4) return 0.01 / Math.sqrt(f);
    if (f <= 8) return 0.005;
    return 0.000625 * f;
  }
  if (f <= 2) return 0.00357;
  return 0.001786 * f;
}

const isHorizontal = (direction: LoadDirection) => direction !== 'vertical';

export type CriteriaInput =
  | { set?: 'custom'; peakAccelerationLimitMPerS2: number }
  | { set: 'setra'; class: 'maximum' | 'mean' | 'minimum' }
  | { set: 'hivoss'; class: 'CL1' | 'CL2' | 'CL3' }
  | { set: 'en1990'; class: 'normal-use' | 'crowd' }
  | { set: 'dg11'; class: keyof typeof dg11WalkingLimitsG }
  | { set: 'iso10137'; class: keyof typeof iso10137ResponseFactors; responseFactor?: number };

const footbridgeCaution =
  'Comfort limits of a guide support, and never replace, the judgement of the engineer of record; the project specification and local codes govern.';

/** Resolves a criteria choice for a mode direction. Throws RangeError (with the field in the message) if it does not apply. */
export function resolveComfortLimit(criteria: CriteriaInput, direction: LoadDirection): ComfortLimit {
  if ('peakAccelerationLimitMPerS2' in criteria) {
    const limit = criteria.peakAccelerationLimitMPerS2;
    if (!(limit > 0)) throw new RangeError(`criteria.peakAccelerationLimitMPerS2 must be > 0, got ${limit}`);
    return {
      set: 'custom', class: 'custom', label: `custom limit ${limit} m/s²`, source: 'project-specific limit',
      limitMPerS2: constant(limit), frequencyDependent: false, caution: footbridgeCaution,
    };
  }
  const horizontal = isHorizontal(direction);
  switch (criteria.set) {
    case 'setra': {
      const row = setraComfortRanges[criteria.class];
      const value = horizontal ? row.horizontal : row.vertical;
      return {
        set: 'setra', class: criteria.class, label: `Sétra ${row.label}, ${horizontal ? 'horizontal' : 'vertical'} ≤ ${value} m/s²`,
        source: setraSource, limitMPerS2: constant(value), frequencyDependent: false,
        applicableRangeHz: horizontal ? [0.3, 1.3] : [1.0, 2.6],
        caution: `${footbridgeCaution} Sétra also advises keeping lateral accelerations below 0.1 m/s² to avoid lock-in.`,
      };
    }
    case 'hivoss': {
      const row = hivossComfortClasses[criteria.class];
      const value = horizontal ? row.horizontal : row.vertical;
      return {
        set: 'hivoss', class: criteria.class, label: `HiVoSS ${row.label}, ${horizontal ? 'horizontal' : 'vertical'} ≤ ${value} m/s²`,
        source: hivossSource, limitMPerS2: constant(value), frequencyDependent: false,
        applicableRangeHz: horizontal ? [0.5, 1.2] : [1.25, 2.3],
        caution: footbridgeCaution,
      };
    }
    case 'en1990': {
      const row = en1990Maxima[criteria.class];
      const value = horizontal ? row.horizontal : row.vertical;
      return {
        set: 'en1990', class: criteria.class,
        label: `EN 1990 A2 ${horizontal ? 'horizontal' : 'vertical'} maximum, ${row.label}: ${value} m/s²`,
        source: en1990Source, limitMPerS2: constant(value), frequencyDependent: false,
        applicableRangeHz: horizontal ? [0, 2.5] : [0, 5],
        caution: `${footbridgeCaution} The values are the recommended ones; the National Annex may set others.`,
      };
    }
    case 'dg11': {
      if (horizontal) throw new RangeError('criteria.set: dg11 limits apply to vertical modes only (structure.direction must be "vertical")');
      const row = dg11WalkingLimitsG[criteria.class];
      const value = row.fractionOfG * standardGravityMPerS2;
      return {
        set: 'dg11', class: criteria.class, label: `DG11 ${row.label}: ${value.toPrecision(4)} m/s²`,
        source: dg11Source, limitMPerS2: constant(value), frequencyDependent: false,
        applicableRangeHz: [0, 9],
        caution: `${footbridgeCaution} DG11's walking criterion covers floors with a natural frequency up to about 9 Hz.`,
      };
    }
    case 'iso10137': {
      const row = iso10137ResponseFactors[criteria.class];
      const r = criteria.responseFactor ?? row.responseFactor;
      if (!(r > 0)) throw new RangeError(`criteria.responseFactor must be > 0, got ${r}`);
      const axis = horizontal ? 'horizontal' : 'vertical';
      return {
        set: 'iso10137', class: criteria.class,
        label: `ISO 10137 ${row.label}: R = ${r} × base curve (${axis}), peak limit √2 R a_base(f)`,
        source: isoSource, limitMPerS2: (f) => Math.SQRT2 * r * iso10137BaseCurveRmsMPerS2(f, axis),
        frequencyDependent: true, applicableRangeHz: [1, 80],
        caution: `${footbridgeCaution} The response factor compares the r.m.s. of the steady harmonic response with the base curve.`,
      };
    }
  }
}

/** The comfort class the peak falls in, for the sets that grade comfort (Sétra ranges 1–4, HiVoSS CL1–CL4). */
export function gradeComfort(set: 'setra' | 'hivoss', direction: LoadDirection, peakAccelerationMPerS2: number): string {
  const table = set === 'setra' ? setraComfortRanges : hivossComfortClasses;
  const horizontal = isHorizontal(direction);
  for (const [name, row] of Object.entries(table)) {
    if (peakAccelerationMPerS2 <= (horizontal ? row.horizontal : row.vertical)) return name;
  }
  return set === 'setra' ? 'unacceptable' : 'CL4';
}
