/**
 * Comfort criteria sets the owner can choose from. Each limit is a peak acceleration (m/s², amplitude of the
 * steady-state harmonic response) and every verdict names the set, the class and the limit used. Where a limit
 * could not be checked against its published source, the verdict's caution says so in plain words.
 *
 * Sources and how sure we are of them (the PRODUCT spec's table of checked values; see docs/engine.md):
 *  - `setra`: Sétra 2006 comfort ranges 1–3 (maximum, mean, minimum comfort; range 4 unacceptable). Vertical
 *    0.5 / 1.0 / 2.5 m/s² confirmed; lateral 0.15 / 0.3 / 0.8 m/s² and the advice to keep lateral accelerations
 *    below 0.10 m/s² against lock-in NOT confirmed (from memory).
 *  - `hivoss`: HiVoSS 2008 comfort classes CL1–CL3 (CL4 unacceptable): class names confirmed; the bands, vertical
 *    0.5 / 1.0 / 2.5 m/s² and lateral 0.1 / 0.3 / 0.8 m/s², NOT confirmed (from memory).
 *  - `en1990`: EN 1990:2002/A1:2005 Annex A2, A2.4.3.2 recommended maxima for footbridges: 0.7 m/s² vertical,
 *    0.2 m/s² horizontal in normal use, 0.4 m/s² horizontal under exceptional crowd; the comfort check is asked for
 *    below 5 Hz for vertical modes and below 2.5 Hz for horizontal (lateral, longitudinal) and torsional modes
 *    (confirmed: national-annex notes quoting it). A torsional mode is checked against the horizontal limits, as
 *    it shares their 2.5 Hz trigger; they are the stricter values, so they also cover the vertical motion of the
 *    deck edge when the mode shape is scaled to 1 at the point of largest motion.
 *  - `dg11`: AISC Design Guide 11 walking limits a0/g: offices, residences, churches 0.5 %g; shopping malls and
 *    indoor footbridges 1.5 %g; outdoor footbridges 5 %g; f_n up to about 9 Hz (confirmed). Vertical modes only.
 *  - `iso10137`: ISO 10137:2007 Annex C, multiples R of the ISO 2631-2 base curve. Vertical base curve
 *    0.005 m/s² r.m.s. on 4–8 Hz, 0.01/√f below, 0.000625 f above (confirmed); response factors office 8,
 *    operating theatre 1, hospital ward 2 (confirmed: hospitals 1–2), residential 4 NOT confirmed (from memory);
 *    horizontal base curve 0.00357 m/s² r.m.s. on 1–2 Hz and 0.001786 f above NOT confirmed (from memory).
 *    The peak limit of a harmonic response is √2 R a_base(f).
 * The guides' comfort tables (Sétra, HiVoSS), DG11 and ISO 10137 give no limit for a torsional mode: they refuse it
 * with a message pointing to EN 1990 A2 or a custom limit.
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
  office: { fractionOfG: 0.005, label: 'offices, residences, churches (0.5 %g)' },
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

/** Lateral and longitudinal modes: the horizontal limits (torsional modes are handled by each set). */
const isHorizontal = (direction: LoadDirection) => direction === 'lateral' || direction === 'longitudinal';

/** The caution of a limit that could not be checked against its published source. */
const fromMemoryCaution = (what: string) =>
  `${what} could not be checked against the published source (from memory): confirm the value before the verdict is relied on.`;

/** Refusal for a set whose source gives no limit for a torsional mode. */
function refuseTorsional(setName: string): never {
  throw new RangeError(
    `criteria.set: ${setName} gives no limit for a torsional mode; choose "en1990" (EN 1990 A2.4.3.2 checks torsional modes below 2.5 Hz against the horizontal limits) or a custom peakAccelerationLimitMPerS2`,
  );
}

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
      if (direction === 'torsional') refuseTorsional('the Sétra 2006 comfort ranges (vertical and lateral)');
      const row = setraComfortRanges[criteria.class];
      const value = horizontal ? row.horizontal : row.vertical;
      const lockInAdvice = 'Sétra also advises keeping lateral accelerations below 0.10 m/s² to avoid lock-in.';
      return {
        set: 'setra', class: criteria.class, label: `Sétra ${row.label}, ${horizontal ? 'horizontal' : 'vertical'} ≤ ${value} m/s²`,
        source: horizontal ? `${setraSource} (lateral ranges from memory)` : setraSource,
        limitMPerS2: constant(value), frequencyDependent: false,
        // Sétra's frequency ranges 1–3: vertical 1.0–5 Hz (range 3, 2.6–5 Hz, for its second-harmonic case),
        // lateral 0.3–2.5 Hz (the lateral range 3 from memory).
        applicableRangeHz: horizontal ? [0.3, 2.5] : [1.0, 5.0],
        caution: horizontal
          ? `${footbridgeCaution} ${lockInAdvice} ${fromMemoryCaution('The Sétra lateral comfort ranges 0.15 / 0.3 / 0.8 m/s² and the 0.10 m/s² lock-in advice')}`
          : `${footbridgeCaution} ${lockInAdvice} ${fromMemoryCaution('That 0.10 m/s² advice')}`,
      };
    }
    case 'hivoss': {
      if (direction === 'torsional') refuseTorsional('the HiVoSS 2008 comfort classes (vertical and lateral)');
      const row = hivossComfortClasses[criteria.class];
      const value = horizontal ? row.horizontal : row.vertical;
      return {
        set: 'hivoss', class: criteria.class, label: `HiVoSS ${row.label}, ${horizontal ? 'horizontal' : 'vertical'} ≤ ${value} m/s²`,
        source: `${hivossSource} (bands from memory)`, limitMPerS2: constant(value), frequencyDependent: false,
        // HiVoSS critical ranges: vertical 1.25–2.3 Hz and, for the second harmonic, up to 4.6 Hz; lateral 0.5–1.2 Hz.
        applicableRangeHz: horizontal ? [0.5, 1.2] : [1.25, 4.6],
        caution: `${footbridgeCaution} ${fromMemoryCaution(`The HiVoSS comfort-class bands (vertical 0.5 / 1.0 / 2.5, lateral 0.1 / 0.3 / 0.8 m/s²)`)}`,
      };
    }
    case 'en1990': {
      // EN 1990 A2.4.3.2: horizontal limits and the 2.5 Hz trigger for lateral, longitudinal and torsional modes.
      const torsional = direction === 'torsional';
      const useHorizontal = horizontal || torsional;
      const row = en1990Maxima[criteria.class];
      const value = useHorizontal ? row.horizontal : row.vertical;
      const what = torsional ? 'horizontal maximum applied to a torsional mode' : `${horizontal ? 'horizontal' : 'vertical'} maximum`;
      return {
        set: 'en1990', class: criteria.class,
        label: `EN 1990 A2 ${what}, ${row.label}: ${value} m/s²`,
        source: en1990Source, limitMPerS2: constant(value), frequencyDependent: false,
        applicableRangeHz: useHorizontal ? [0, 2.5] : [0, 5],
        caution: torsional
          ? `${footbridgeCaution} The values are the recommended ones; the National Annex may set others. EN 1990 A2.4.3.2 asks for the check of torsional modes below 2.5 Hz; Stillspan applies the horizontal limit to the acceleration at the point where the mode shape is 1 (the stricter value, which also covers the vertical motion of the deck edge).`
          : `${footbridgeCaution} The values are the recommended ones; the National Annex may set others.`,
      };
    }
    case 'dg11': {
      if (direction !== 'vertical') {
        throw new RangeError(`criteria.set: dg11 limits apply to vertical modes only (structure.direction must be "vertical", got "${direction}")`);
      }
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
      if (direction === 'torsional') refuseTorsional('ISO 10137 (vertical and horizontal base curves)');
      const row = iso10137ResponseFactors[criteria.class];
      const r = criteria.responseFactor ?? row.responseFactor;
      if (!(r > 0)) throw new RangeError(`criteria.responseFactor must be > 0, got ${r}`);
      const axis = horizontal ? 'horizontal' : 'vertical';
      const unconfirmed = [
        ...(criteria.class === 'residential' && criteria.responseFactor === undefined ? ['The residential response factor R = 4'] : []),
        ...(horizontal ? ['The horizontal base curve (0.00357 m/s² r.m.s. on 1–2 Hz, 0.001786 f above)'] : []),
      ];
      return {
        set: 'iso10137', class: criteria.class,
        label: `ISO 10137 ${row.label}: R = ${r} × base curve (${axis}), peak limit √2 R a_base(f)`,
        source: unconfirmed.length ? `${isoSource} (${unconfirmed.map((u) => u.replace(/^The /, '')).join('; ')}: from memory)` : isoSource,
        limitMPerS2: (f) => Math.SQRT2 * r * iso10137BaseCurveRmsMPerS2(f, axis),
        frequencyDependent: true, applicableRangeHz: [1, 80],
        caution:
          `${footbridgeCaution} The response factor compares the r.m.s. of the steady harmonic response with the base curve.` +
          unconfirmed.map((u) => ` ${fromMemoryCaution(u)}`).join(''),
      };
    }
  }
}

/** The comfort class the peak falls in, for the sets that grade comfort (Sétra ranges 1–4, HiVoSS CL1–CL4). */
export function gradeComfort(set: 'setra' | 'hivoss', direction: LoadDirection, peakAccelerationMPerS2: number): string {
  if (direction === 'torsional') throw new RangeError(`direction: the ${set === 'setra' ? 'Sétra' : 'HiVoSS'} comfort grades have no torsional range`);
  const table = set === 'setra' ? setraComfortRanges : hivossComfortClasses;
  const horizontal = isHorizontal(direction);
  for (const [name, row] of Object.entries(table)) {
    if (peakAccelerationMPerS2 <= (horizontal ? row.horizontal : row.vertical)) return name;
  }
  return set === 'setra' ? 'unacceptable' : 'CL4';
}
