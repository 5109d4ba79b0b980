/**
 * Comfort criteria in plain words for the owner who signs them: each limit as a sentence with its unit and its
 * source, and the values that could not be checked against the published source marked "from memory" (the status of
 * each value follows the engine's notes in shared/engine/criteria.ts). The numbers come from the engine's tables.
 */
import type { ComfortCriteria } from '../../../../shared/contracts';
import {
  dg11WalkingLimitsG,
  en1990Maxima,
  hivossComfortClasses,
  iso10137BaseCurveRmsMPerS2,
  iso10137ResponseFactors,
  setraComfortRanges,
} from '../../../../shared/engine/criteria';
import { standardGravityMPerS2 } from '../../../../shared/engine/loads/floor-walking';
import { formatNumber } from '../../../lib/format';

export type CriteriaSpec = ComfortCriteria['spec'];
export type CriteriaSet = CriteriaSpec['set'];

export interface LimitLine {
  /** The limit in one sentence, with its unit and source. */
  text: string;
  /** True where the value could not be checked against the published source. */
  fromMemory: boolean;
}

export const criteriaSetLabels: Record<CriteriaSet, string> = {
  setra: 'Sétra 2006 comfort range (footbridges)',
  hivoss: 'HiVoSS 2008 comfort class (footbridges)',
  en1990: 'EN 1990 Annex A2 code limit (footbridges)',
  dg11: 'AISC Design Guide 11 walking limit (floors, footbridges)',
  iso10137: 'ISO 10137 multiple of the base curve (floors)',
  custom: 'Custom limit for this project',
};

/** The classes of each set with the owner's words for them. */
export const criteriaClasses: { [S in Exclude<CriteriaSet, 'custom'>]: { value: string; label: string }[] } = {
  setra: [
    { value: 'maximum', label: 'Maximum comfort (range 1)' },
    { value: 'mean', label: 'Mean comfort (range 2)' },
    { value: 'minimum', label: 'Minimum comfort (range 3)' },
  ],
  hivoss: [
    { value: 'CL1', label: 'CL1 — maximum comfort' },
    { value: 'CL2', label: 'CL2 — medium comfort' },
    { value: 'CL3', label: 'CL3 — minimum comfort' },
  ],
  en1990: [
    { value: 'normal-use', label: 'Normal use' },
    { value: 'crowd', label: 'Exceptional crowd conditions' },
  ],
  dg11: [
    { value: 'office', label: 'Offices, residences, churches' },
    { value: 'shopping-mall', label: 'Shopping malls' },
    { value: 'indoor-footbridge', label: 'Indoor footbridges' },
    { value: 'outdoor-footbridge', label: 'Outdoor footbridges' },
  ],
  iso10137: [
    { value: 'operating-theatre', label: 'Hospital operating theatre (R = 1)' },
    { value: 'hospital-ward', label: 'Hospital ward (R = 2)' },
    { value: 'residential', label: 'Residential (R = 4)' },
    { value: 'office', label: 'Office (R = 8)' },
  ],
};

const ms2 = (value: number) => `${formatNumber(value, 3)} m/s²`;

/** The limits of a criteria choice, one sentence each. */
export function describeCriteria(spec: CriteriaSpec): LimitLine[] {
  switch (spec.set) {
    case 'custom':
      return [{ text: `Peak acceleration at most ${ms2(spec.peakAccelerationLimitMPerS2)}, in every direction (a limit set for this project).`, fromMemory: false }];
    case 'setra': {
      const row = setraComfortRanges[spec.class];
      const name = `Sétra 2006, ${row.label}`;
      return [
        { text: `Peak vertical acceleration at most ${ms2(row.vertical)} (${name}).`, fromMemory: false },
        { text: `Peak lateral acceleration at most ${ms2(row.horizontal)} (${name}).`, fromMemory: true },
        { text: 'Sétra also advises keeping lateral accelerations below 0.10 m/s² so that walkers do not lock in with the deck.', fromMemory: true },
      ];
    }
    case 'hivoss': {
      const row = hivossComfortClasses[spec.class];
      const name = `HiVoSS 2008, comfort class ${row.label}`;
      return [
        { text: `Peak vertical acceleration at most ${ms2(row.vertical)} (${name}).`, fromMemory: true },
        { text: `Peak lateral acceleration at most ${ms2(row.horizontal)} (${name}).`, fromMemory: true },
      ];
    }
    case 'en1990': {
      const row = en1990Maxima[spec.class ?? 'normal-use'];
      const name = `EN 1990 Annex A2, A2.4.3.2, ${row.label}; the National Annex may set other values`;
      return [
        { text: `Peak vertical acceleration at most ${ms2(row.vertical)} (${name}); checked for vertical modes below 5 Hz.`, fromMemory: false },
        {
          text: `Peak horizontal acceleration at most ${ms2(row.horizontal)} (${name}); checked for lateral, longitudinal and torsional modes below 2.5 Hz.`,
          fromMemory: false,
        },
      ];
    }
    case 'dg11': {
      const row = dg11WalkingLimitsG[spec.class];
      const use = criteriaClasses.dg11.find((entry) => entry.value === spec.class)?.label.toLowerCase() ?? spec.class;
      return [
        {
          text:
            `Peak vertical acceleration under walking at most ${formatNumber(row.fractionOfG * 100, 2)} % of g = ${ms2(row.fractionOfG * standardGravityMPerS2)} ` +
            `(AISC Design Guide 11, ${use}); for structures with a natural frequency up to about 9 Hz.`,
          fromMemory: false,
        },
      ];
    }
    case 'iso10137': {
      const row = iso10137ResponseFactors[spec.class];
      const r = spec.responseFactor ?? row.responseFactor;
      const givenR = spec.responseFactor !== undefined;
      const plateau = Math.SQRT2 * r * iso10137BaseCurveRmsMPerS2(6, 'vertical');
      const horizontal = Math.SQRT2 * r * iso10137BaseCurveRmsMPerS2(1.5, 'horizontal');
      return [
        {
          text:
            `Vertical vibration at most ${formatNumber(r)} × the ISO 2631-2 base curve (ISO 10137 Annex C, ${row.label}${givenR ? `, R = ${formatNumber(r)} as given` : ''}): ` +
            `a peak of √2 × ${formatNumber(r)} × 0.005 = ${ms2(plateau)} between 4 and 8 Hz, more below 4 Hz and above 8 Hz.`,
          fromMemory: spec.class === 'residential' && !givenR,
        },
        {
          text: `Horizontal vibration at most ${formatNumber(r)} × the horizontal base curve: a peak of ${ms2(horizontal)} between 1 and 2 Hz.`,
          fromMemory: true,
        },
      ];
    }
  }
}

/** The set and class in a few words, for a list. */
export function criteriaTitle(spec: CriteriaSpec): string {
  if (spec.set === 'custom') return criteriaSetLabels.custom;
  const classes = criteriaClasses[spec.set] as { value: string; label: string }[];
  const cls = classes.find((entry) => entry.value === (spec.class ?? 'normal-use'));
  return `${criteriaSetLabels[spec.set]}: ${cls?.label ?? spec.class}`;
}
