/**
 * As-built comparison of a tuned mass damper: what the fabricator measured on each unit against the hardware sheet
 * of the approved design. One pure function, used by the server (stored with every answer) and the page alike.
 *
 * Relations (single-degree-of-freedom oscillator, e.g. Chopra, "Dynamics of Structures", ch. 2, from memory; Den
 * Hartog, "Mechanical Vibrations", 1956, for the absorber as a mass on springs):
 *   implied frequency   f = (1/2π) √(k/m)
 *   at constant mass    k ∝ f²      (the sheet's spring-rate range for the tuning range's ends)
 *   at constant springs m ∝ 1/f²    (the sheet's moving-mass range: the heavier end tunes the low frequency)
 * Deviation = measured − design, in the unit and in % of the design value. Each range check is inclusive.
 * The design numbers are read from the approved result exactly as the hardware sheet reads them
 * (shared/compute/hardware-sheet.ts: the hardware entry of the load case with the largest design stroke; every entry
 * of a result carries the same damper), never recomputed.
 */
import type { SignOffSnapshot } from '../contracts/sign-offs';
import type { HardwareSheetEntry } from '../contracts/compute-design';
import type { AsBuiltComparison, AsBuiltUnitComparison, AsBuiltUnitInput, RangeVerdict } from '../contracts/as-built';
import { governingHardwareEntry, HardwareSheetUnavailableError } from './hardware-sheet';
import { massRatioWarningRange } from '../engine/design';

/** Per-unit design numbers and tuning range of an approved damper (the "per unit" and "tuning range" rows of the sheet). */
export interface AsBuiltDesign {
  unitCount: number;
  movingMassPerUnitKg: number;
  springRatePerUnitNPerM: number;
  /** The damper's own target frequency f_a. */
  frequencyHz: number;
  frequencyLowHz: number;
  frequencyHighHz: number;
  /** Spring rate per unit at the design mass for the low and the high end of the tuning range. */
  springRatePerUnitLowNPerM: number;
  springRatePerUnitHighNPerM: number;
  /** Moving mass per unit at the design springs: the light end tunes the high frequency, the heavy end the low one. */
  movingMassPerUnitLowKg: number;
  movingMassPerUnitHighKg: number;
  totalMovingMassKg: number;
  modalMassKg: number;
}

/** Thrown when the approved result holds no hardware entry to compare with (the hardware sheet's own error). */
export { HardwareSheetUnavailableError as AsBuiltDesignUnavailableError };

/** The hardware entry the sheet is built from (the load case needing the largest design stroke), by the sheet's own rule. */
function sheetEntry(snapshot: SignOffSnapshot): HardwareSheetEntry {
  return governingHardwareEntry(snapshot).entry;
}

export function asBuiltDesignFromEntry(entry: HardwareSheetEntry, modalMassKg: number): AsBuiltDesign {
  const n = entry.unitCount;
  const r = entry.tuningRange;
  return {
    unitCount: n,
    movingMassPerUnitKg: entry.perUnit.movingMassKg,
    springRatePerUnitNPerM: entry.perUnit.springRateNPerM,
    frequencyHz: entry.frequencyHz,
    frequencyLowHz: r.minFrequencyHz,
    frequencyHighHz: r.maxFrequencyHz,
    springRatePerUnitLowNPerM: r.minSpringRateNPerM / n,
    springRatePerUnitHighNPerM: r.maxSpringRateNPerM / n,
    movingMassPerUnitLowKg: r.minMovingMassKg / n,
    movingMassPerUnitHighKg: r.maxMovingMassKg / n,
    totalMovingMassKg: entry.movingMassKg,
    modalMassKg,
  };
}

/** The design numbers of an approved sign-off's snapshot, as its hardware sheet gives them. */
export function asBuiltDesignOf(snapshot: SignOffSnapshot): AsBuiltDesign {
  return asBuiltDesignFromEntry(sheetEntry(snapshot), snapshot.mode.modalMassKg);
}

/** f = (1/2π) √(k/m), Hz. */
export function impliedFrequencyHz(movingMassKg: number, springRateNPerM: number): number {
  if (!(movingMassKg > 0) || !Number.isFinite(movingMassKg)) throw new RangeError(`movingMassKg must be a finite number > 0, got ${movingMassKg}`);
  if (!(springRateNPerM > 0) || !Number.isFinite(springRateNPerM)) throw new RangeError(`springRateNPerM must be a finite number > 0, got ${springRateNPerM}`);
  return Math.sqrt(springRateNPerM / movingMassKg) / (2 * Math.PI);
}

function deviation(designValue: number, measuredValue: number) {
  const absolute = measuredValue - designValue;
  return { designValue, measuredValue, absolute, percent: (absolute / designValue) * 100 };
}

/** Inclusive, with a relative allowance of 1e-12 so that a value read back at a range's end is inside it. */
function verdict(value: number, low: number, high: number): RangeVerdict {
  const slack = 1e-12 * Math.max(Math.abs(low), Math.abs(high));
  if (value < low - slack) return 'below';
  if (value > high + slack) return 'above';
  return 'inside';
}

/** Three significant figures, more when needed to tell the value from the range's end it is compared with. */
function shown(value: number, other?: number): string {
  for (let digits = 3; digits <= 8; digits++) {
    const text = plain(value, digits);
    if (other === undefined || text !== plain(other, digits)) return text;
  }
  return plain(value, 8);
}

function plain(value: number, digits: number): string {
  if (Math.abs(value) >= 10 ** digits) return String(Math.round(value));
  return String(Number(value.toPrecision(digits)));
}

function rangeText(value: number, low: number, high: number, unit: string, v: RangeVerdict): { valueText: string; range: string } {
  const bound = v === 'above' ? high : low;
  return { valueText: `${shown(value, bound)} ${unit}`, range: `${shown(low, value)}–${shown(high, value)} ${unit}` };
}

const frequencyAdvice: Record<Exclude<RangeVerdict, 'inside'>, string> = {
  above: 'add mass or soften the springs',
  below: 'remove mass or stiffen the springs',
};

function checkDesign(design: AsBuiltDesign): void {
  const positive: (keyof AsBuiltDesign)[] = [
    'movingMassPerUnitKg',
    'springRatePerUnitNPerM',
    'frequencyHz',
    'frequencyLowHz',
    'frequencyHighHz',
    'springRatePerUnitLowNPerM',
    'springRatePerUnitHighNPerM',
    'movingMassPerUnitLowKg',
    'movingMassPerUnitHighKg',
    'totalMovingMassKg',
    'modalMassKg',
  ];
  for (const key of positive) {
    const value = design[key];
    if (!Number.isFinite(value) || !(value > 0)) throw new RangeError(`design.${key} must be a finite number > 0, got ${value}`);
  }
  if (!Number.isInteger(design.unitCount) || design.unitCount < 1) throw new RangeError(`design.unitCount must be an integer ≥ 1, got ${design.unitCount}`);
}

function compareUnit(design: AsBuiltDesign, unit: AsBuiltUnitInput): AsBuiltUnitComparison {
  const label = `Unit ${unit.unitNumber}`;
  const warnings: string[] = [];
  const m = unit.movingMassKg;
  const k = unit.springRateNPerM;
  const f = unit.frequencyHz;
  const fImplied = k !== undefined ? impliedFrequencyHz(m, k) : undefined;

  const fLow = design.frequencyLowHz;
  const fHigh = design.frequencyHighHz;
  const frequencyRange = f === undefined ? null : { low: fLow, high: fHigh, verdict: verdict(f, fLow, fHigh) };
  const impliedFrequencyRange = fImplied === undefined ? null : { low: fLow, high: fHigh, verdict: verdict(fImplied, fLow, fHigh) };
  const massRange = { low: design.movingMassPerUnitLowKg, high: design.movingMassPerUnitHighKg, verdict: verdict(m, design.movingMassPerUnitLowKg, design.movingMassPerUnitHighKg) };
  const springRateRange =
    k === undefined ? null : { low: design.springRatePerUnitLowNPerM, high: design.springRatePerUnitHighNPerM, verdict: verdict(k, design.springRatePerUnitLowNPerM, design.springRatePerUnitHighNPerM) };

  if (frequencyRange && frequencyRange.verdict !== 'inside') {
    const t = rangeText(f as number, fLow, fHigh, 'Hz', frequencyRange.verdict);
    warnings.push(`${label}: measured ${t.valueText} is ${frequencyRange.verdict} the tuning range ${t.range}; ${frequencyAdvice[frequencyRange.verdict]}`);
  }
  if (impliedFrequencyRange && impliedFrequencyRange.verdict !== 'inside') {
    const t = rangeText(fImplied as number, fLow, fHigh, 'Hz', impliedFrequencyRange.verdict);
    warnings.push(
      `${label}: the frequency implied by the measured mass and spring rate, ${t.valueText}, is ${impliedFrequencyRange.verdict} the tuning range ${t.range}; ${frequencyAdvice[impliedFrequencyRange.verdict]}`,
    );
  }
  if (massRange.verdict !== 'inside') {
    const t = rangeText(m, massRange.low, massRange.high, 'kg', massRange.verdict);
    const advice = massRange.verdict === 'above' ? 'remove mass blocks or stiffen the springs' : 'add mass blocks or soften the springs';
    const compensated = impliedFrequencyRange?.verdict === 'inside' ? ' (with the measured spring rate the implied frequency is inside the tuning range)' : '';
    warnings.push(`${label}: moving mass ${t.valueText} is ${massRange.verdict} ${t.range}, the range the design springs can tune; ${advice}${compensated}`);
  }
  if (springRateRange && springRateRange.verdict !== 'inside') {
    const t = rangeText(k as number, springRateRange.low, springRateRange.high, 'N/m', springRateRange.verdict);
    const advice = springRateRange.verdict === 'above' ? 'soften the springs or add mass' : 'stiffen the springs or remove mass';
    const compensated = impliedFrequencyRange?.verdict === 'inside' ? ' (with the measured mass the implied frequency is inside the tuning range)' : '';
    warnings.push(`${label}: spring rate ${t.valueText} is ${springRateRange.verdict} ${t.range}, the range for the design mass; ${advice}${compensated}`);
  }

  return {
    unitNumber: unit.unitNumber,
    movingMassKg: deviation(design.movingMassPerUnitKg, m),
    springRateNPerM: k === undefined ? null : deviation(design.springRatePerUnitNPerM, k),
    frequencyHz: f === undefined ? null : deviation(design.frequencyHz, f),
    impliedFrequencyHz: fImplied === undefined ? null : deviation(design.frequencyHz, fImplied),
    massRange,
    springRateRange,
    frequencyRange,
    impliedFrequencyRange,
    withinTuningRange: warnings.length === 0,
    warnings,
  };
}

/**
 * Compares measured units with the design. `units` must name each unit once, numbered 1..unitCount (the contract's
 * schema checks that at the edge; here it is a RangeError).
 */
export function compareAsBuilt(design: AsBuiltDesign, units: readonly AsBuiltUnitInput[]): AsBuiltComparison {
  checkDesign(design);
  if (units.length === 0) throw new RangeError('units must list at least one unit');
  const seen = new Set<number>();
  for (const unit of units) {
    if (!Number.isInteger(unit.unitNumber) || unit.unitNumber < 1 || unit.unitNumber > design.unitCount) {
      throw new RangeError(`unitNumber must be an integer in 1..${design.unitCount}, got ${unit.unitNumber}`);
    }
    if (seen.has(unit.unitNumber)) throw new RangeError(`unit ${unit.unitNumber} is listed twice`);
    seen.add(unit.unitNumber);
  }
  const compared = [...units].sort((a, b) => a.unitNumber - b.unitNumber).map((unit) => compareUnit(design, unit));

  let measuredTotalKg = 0;
  for (const unit of units) measuredTotalKg += unit.movingMassKg;
  const recordedMovingMassKg = deviation(design.movingMassPerUnitKg * units.length, measuredTotalKg);
  const allRecorded = units.length === design.unitCount;
  const builtMassRatio = allRecorded ? measuredTotalKg / design.modalMassKg : null;

  const warnings = compared.flatMap((unit) => unit.warnings);
  // The design's own mass-ratio band (shared/engine/design.ts; PRODUCT cautions: usual mass ratios 0.5–10 %).
  if (builtMassRatio !== null && (builtMassRatio < massRatioWarningRange[0] || builtMassRatio > massRatioWarningRange[1])) {
    warnings.push(
      `The mass ratio built, ${shown(builtMassRatio * 100)} %, is outside the usual 0.5–10 % of the modal mass; have the design checked for this damper`,
    );
  }

  return {
    unitCount: design.unitCount,
    recordedUnitCount: units.length,
    design: {
      movingMassPerUnitKg: design.movingMassPerUnitKg,
      springRatePerUnitNPerM: design.springRatePerUnitNPerM,
      frequencyHz: design.frequencyHz,
      totalMovingMassKg: design.totalMovingMassKg,
      modalMassKg: design.modalMassKg,
      massRatio: design.totalMovingMassKg / design.modalMassKg,
    },
    units: compared,
    recordedMovingMassKg,
    builtMassRatio,
    unitsOutsideRange: compared.filter((unit) => !unit.withinTuningRange).map((unit) => unit.unitNumber),
    warnings,
  };
}
