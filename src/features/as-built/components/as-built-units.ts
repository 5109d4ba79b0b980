import { formatNumber, formatSignedNumber } from '../../../lib/format';
import { formatInUnits, toDisplay, unitLabel, type Quantity } from '../../../lib/units';

/**
 * The as-built comparison carries SI values (kg, N/m, Hz). For a person who reads US customary units the table adds
 * the value in those units beside each SI one, as the hardware sheet above it does (src/lib/units.ts, NIST SP 811
 * factors); the record and its form stay SI. Hz has no US customary counterpart and gets none.
 */
export type AsBuiltQuantity = Extract<Quantity, 'mass' | 'stiffness'>;

/** "551.2 lb", "222.7 lbf/in": an SI value in US customary units at `significant` figures. */
export function usCustomaryText(quantity: AsBuiltQuantity, siValue: number, significant = 4): string {
  return formatInUnits(quantity, siValue, 'us-customary', significant);
}

/** A signed deviation in US customary units: "+22.05 lb", "−3.4 lbf/in" (the sign as the SI deviation shows it). */
export function usCustomaryDeviation(quantity: AsBuiltQuantity, siDeviation: number, significant = 3): string {
  return `${formatSignedNumber(toDisplay(quantity, siDeviation, 'us-customary'), significant)} ${unitLabel(quantity, 'us-customary')}`;
}

/** A range in US customary units: "529.1–573.2 lb". */
export function usCustomaryRange(quantity: AsBuiltQuantity, lowSi: number, highSi: number, significant = 3): string {
  const number = (siValue: number) => formatNumber(toDisplay(quantity, siValue, 'us-customary'), significant);
  return `${number(lowSi)}–${number(highSi)} ${unitLabel(quantity, 'us-customary')}`;
}
