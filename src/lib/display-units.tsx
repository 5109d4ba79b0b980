import { createContext, useContext, useMemo } from 'react';
import { formatInUnits, fromDisplay, toDisplay, unitLabel, type Quantity, type UnitSystem } from './units';

const UnitSystemContext = createContext<UnitSystem>('si');

/** Gives the pages below it the signed-in person's unit system (SI when none is known yet). */
export const UnitSystemProvider = UnitSystemContext.Provider;

export interface DisplayUnits {
  system: UnitSystem;
  /** The unit label of a quantity ("kg" or "lb"). */
  label: (quantity: Quantity) => string;
  /** An SI value in the display unit. */
  toDisplay: (quantity: Quantity, siValue: number) => number;
  /** A typed display value back in SI. */
  toSI: (quantity: Quantity, displayValue: number) => number;
  /** An SI value as display text with its unit: "1,234 kg", "2,722 lb", "5.1 %g". */
  format: (quantity: Quantity, siValue: number | null | undefined, significant?: number) => string;
}

/** The display units of the signed-in person: every number on screen goes through these. */
export function useDisplayUnits(): DisplayUnits {
  const system = useContext(UnitSystemContext);
  return useMemo<DisplayUnits>(
    () => ({
      system,
      label: (quantity) => unitLabel(quantity, system),
      toDisplay: (quantity, siValue) => toDisplay(quantity, siValue, system),
      toSI: (quantity, displayValue) => fromDisplay(quantity, displayValue, system),
      format: (quantity, siValue, significant = 4) =>
        siValue === null || siValue === undefined ? '—' : formatInUnits(quantity, siValue, system, significant),
    }),
    [system],
  );
}
