import { formatNumber } from '../../../lib/format';
import { toDisplay, unitLabel, type Quantity } from '../../../lib/units';

/**
 * The hardware sheet's rows carry SI values with lengths in mm (as its CSV and PDF do). For a person who reads US
 * customary units the page adds the value in those units beside it (src/lib/units.ts, NIST SP 811 factors); the files
 * stay SI. Units without a US customary counterpart (Hz, ratios, counts, texts) get none.
 */
const quantityOfUnit: Record<string, { quantity: Quantity; toSI: number }> = {
  kg: { quantity: 'mass', toSI: 1 },
  'N/m': { quantity: 'stiffness', toSI: 1 },
  'N·s/m': { quantity: 'damping', toSI: 1 },
  mm: { quantity: 'displacement', toSI: 1 / 1000 },
  N: { quantity: 'force', toSI: 1 },
  'm/s²': { quantity: 'acceleration', toSI: 1 },
};

/** The row's value in US customary units with its label ("1.102 in"), at `significant` figures; null when none applies. */
export function usCustomaryValue(value: number | string, unit: string, significant = 4): string | null {
  const known = quantityOfUnit[unit];
  if (typeof value !== 'number' || !known) return null;
  return `${formatNumber(toDisplay(known.quantity, value * known.toSI, 'us-customary'), significant)} ${unitLabel(known.quantity, 'us-customary')}`;
}
