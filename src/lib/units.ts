/**
 * Display units. Everything stored and sent to the API is SI; a person may choose to read and type numbers in US
 * customary units instead. Conversions happen only here, at the edge of the screen and of the forms.
 *
 * Exact definitions (NIST Special Publication 811, 2008 edition, appendix B):
 *   1 lb (avoirdupois pound)  = 0.45359237 kg           (exact)
 *   1 in                      = 0.0254 m                (exact)
 *   1 ft                      = 0.3048 m                (exact)
 *   g_n (standard gravity)    = 9.80665 m/s²            (exact)
 *   1 lbf                     = 1 lb × g_n = 4.4482216152605 N (exact, the product of the two)
 * Frequencies (Hz), damping ratios and mass ratios have no unit to convert.
 */

import type { UnitSystem } from '../../shared/contracts/preferences';
import { formatNumber } from './format';

export type { UnitSystem };

export const KG_PER_LB = 0.45359237;
export const M_PER_IN = 0.0254;
export const M_PER_FT = 0.3048;
export const STANDARD_GRAVITY_M_PER_S2 = 9.80665;
export const N_PER_LBF = KG_PER_LB * STANDARD_GRAVITY_M_PER_S2;

/** The quantities the pages show, each with its SI unit inside. */
export type Quantity =
  | 'mass' // kg
  | 'force' // N
  | 'length' // m (spans, widths)
  | 'displacement' // m (strokes, deflections: shown in mm or in)
  | 'area' // m²
  | 'stiffness' // N/m
  | 'damping' // N·s/m
  | 'acceleration' // m/s²
  | 'frequency'; // Hz

interface UnitDefinition {
  /** Unit label shown beside a number. */
  label: string;
  /** SI value × factor = displayed value. */
  factor: number;
}

const si: Record<Quantity, UnitDefinition> = {
  mass: { label: 'kg', factor: 1 },
  force: { label: 'N', factor: 1 },
  length: { label: 'm', factor: 1 },
  displacement: { label: 'mm', factor: 1000 },
  area: { label: 'm²', factor: 1 },
  stiffness: { label: 'N/m', factor: 1 },
  damping: { label: 'N·s/m', factor: 1 },
  acceleration: { label: 'm/s²', factor: 1 },
  frequency: { label: 'Hz', factor: 1 },
};

const usCustomary: Record<Quantity, UnitDefinition> = {
  mass: { label: 'lb', factor: 1 / KG_PER_LB },
  force: { label: 'lbf', factor: 1 / N_PER_LBF },
  length: { label: 'ft', factor: 1 / M_PER_FT },
  displacement: { label: 'in', factor: 1 / M_PER_IN },
  area: { label: 'ft²', factor: 1 / (M_PER_FT * M_PER_FT) },
  // lbf/in: (N/m) × (m/in) / (N/lbf)
  stiffness: { label: 'lbf/in', factor: M_PER_IN / N_PER_LBF },
  damping: { label: 'lbf·s/in', factor: M_PER_IN / N_PER_LBF },
  // Acceleration as a percentage of standard gravity, the habit of US floor-vibration practice.
  acceleration: { label: '%g', factor: 100 / STANDARD_GRAVITY_M_PER_S2 },
  frequency: { label: 'Hz', factor: 1 },
};

const systems: Record<UnitSystem, Record<Quantity, UnitDefinition>> = { si, 'us-customary': usCustomary };

/** The label of a quantity's unit in a unit system ("kg", "lb", "%g"). */
export function unitLabel(quantity: Quantity, system: UnitSystem): string {
  return systems[system][quantity].label;
}

/** An SI value in the display unit of the system. */
export function toDisplay(quantity: Quantity, siValue: number, system: UnitSystem): number {
  return siValue * systems[system][quantity].factor;
}

/** A value typed in the display unit of the system, back to SI (forms convert here before validating). */
export function fromDisplay(quantity: Quantity, displayValue: number, system: UnitSystem): number {
  return displayValue / systems[system][quantity].factor;
}

/** An SI value as text in the display unit of the system: "1,234 kg", "2,722 lb", "5.1 %g". */
export function formatInUnits(quantity: Quantity, siValue: number, system: UnitSystem, significant = 4): string {
  return `${formatNumber(toDisplay(quantity, siValue, system), significant)} ${unitLabel(quantity, system)}`;
}

export function describeUnitSystem(system: UnitSystem): string {
  return system === 'si' ? 'SI (kg, N, m, mm, m/s²)' : 'US customary (lb, lbf, ft, in, %g)';
}
