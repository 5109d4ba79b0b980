import { formatInUnits, type Quantity } from '../../../lib/units';

/**
 * The hardware sheet's rows carry SI values with lengths in mm (as its CSV and PDF do). For a person who reads US
 * customary units the page adds the value in those units beside it (src/lib/units.ts, NIST SP 811 factors); the files
 * stay SI. Units without a US customary counterpart (Hz, ratios, counts, texts) get none.
 */
const quantityOfUnit: Record<string, { quantity: Quantity; siPerSheetUnit: number }> = {
  kg: { quantity: 'mass', siPerSheetUnit: 1 },
  'N/m': { quantity: 'stiffness', siPerSheetUnit: 1 },
  'N·s/m': { quantity: 'damping', siPerSheetUnit: 1 },
  mm: { quantity: 'displacement', siPerSheetUnit: 1 / 1000 }, // m per mm
  N: { quantity: 'force', siPerSheetUnit: 1 },
  'm/s²': { quantity: 'acceleration', siPerSheetUnit: 1 },
};

/** The row's value in US customary units with its label ("1.102 in"), at `significant` figures; null when none applies. */
export function usCustomaryValue(value: number | string, unit: string, significant = 4): string | null {
  const known = quantityOfUnit[unit];
  if (typeof value !== 'number' || !known) return null;
  return formatInUnits(known.quantity, value * known.siPerSheetUnit, 'us-customary', significant);
}
