/**
 * Hardware numbers of a tuned mass damper for the fabricator (PRODUCT conventions: ζ_a referred to the damper's own
 * frequency):
 *   spring rate           k = m ω_a²
 *   damper coefficient    c = 2 ζ_a m ω_a
 *   static deflection     δ = m g / k = g / ω_a²   (g = 9.80665 m/s², standard gravity)
 * The moving mass may be split over n equal units (each m/n with k/n and c/n, so each unit has the same frequency
 * and damping ratio as the whole) and each unit over s equal springs in parallel (k/(n s) each).
 * Design stroke = margin × the largest steady-state stroke amplitude over the load band. The site tuning range
 * is ±r about the design frequency: the spring rate needed at constant moving mass (k ∝ f²), or the moving mass
 * at constant springs (m ∝ 1/f², i.e. mass blocks added or removed).
 */

import type { TmdParameters } from './types';
import type { HardwareOptions, HardwareSheetEntry } from '../contracts/compute-design';
import { standardGravityMPerS2 } from './loads/floor-walking';

/**
 * Options of the hardware numbers (unit count, springs per unit, stroke margin and limit, tuning range) and one
 * damper's entry of the hardware sheet: the types of their contracts (compute-design.ts).
 */
export type { HardwareOptions, HardwareSheetEntry };

export function springRateNPerM(massKg: number, frequencyHz: number): number {
  const w = 2 * Math.PI * frequencyHz;
  return massKg * w * w;
}

export function damperCoefficientNsPerM(massKg: number, frequencyHz: number, dampingRatio: number): number {
  return 2 * dampingRatio * massKg * 2 * Math.PI * frequencyHz;
}

export function staticDeflectionM(frequencyHz: number): number {
  const w = 2 * Math.PI * frequencyHz;
  return standardGravityMPerS2 / (w * w);
}

export function buildHardwareEntry(tmd: TmdParameters, maximumStrokeM: number, options: HardwareOptions = {}): HardwareSheetEntry {
  const unitCount = options.unitCount ?? 1;
  const springsPerUnit = options.springsPerUnit ?? 4;
  const margin = options.strokeMarginFactor ?? 1.5;
  const ratio = options.tuningRangeRatio ?? 0.15;
  if (!Number.isInteger(unitCount) || unitCount < 1) throw new RangeError(`hardware.unitCount must be an integer ≥ 1, got ${unitCount}`);
  if (!Number.isInteger(springsPerUnit) || springsPerUnit < 1) {
    throw new RangeError(`hardware.springsPerUnit must be an integer ≥ 1, got ${springsPerUnit}`);
  }
  if (!(margin >= 1)) throw new RangeError(`hardware.strokeMarginFactor must be ≥ 1, got ${margin}`);
  if (!(ratio >= 0 && ratio < 1)) throw new RangeError(`hardware.tuningRangeRatio must be in [0, 1), got ${ratio}`);
  const k = springRateNPerM(tmd.massKg, tmd.frequencyHz);
  const c = damperCoefficientNsPerM(tmd.massKg, tmd.frequencyHz, tmd.dampingRatio);
  const designStrokeM = margin * maximumStrokeM;
  const limit = options.strokeLimitM ?? null;
  const fLo = tmd.frequencyHz * (1 - ratio);
  const fHi = tmd.frequencyHz * (1 + ratio);
  return {
    movingMassKg: tmd.massKg,
    frequencyHz: tmd.frequencyHz,
    dampingRatio: tmd.dampingRatio,
    springRateNPerM: k,
    damperCoefficientNsPerM: c,
    staticDeflectionM: staticDeflectionM(tmd.frequencyHz),
    maximumStrokeM,
    strokeMarginFactor: margin,
    designStrokeM,
    strokeLimitM: limit,
    strokeWithinLimit: limit === null ? null : designStrokeM <= limit,
    unitCount,
    springsPerUnit,
    perUnit: {
      movingMassKg: tmd.massKg / unitCount,
      springRateNPerM: k / unitCount,
      springRatePerSpringNPerM: k / (unitCount * springsPerUnit),
      damperCoefficientNsPerM: c / unitCount,
    },
    tuningRange: {
      ratio,
      minFrequencyHz: fLo,
      maxFrequencyHz: fHi,
      minSpringRateNPerM: springRateNPerM(tmd.massKg, fLo),
      maxSpringRateNPerM: springRateNPerM(tmd.massKg, fHi),
      minMovingMassKg: fHi > 0 ? k / (2 * Math.PI * fHi) ** 2 : Infinity,
      maxMovingMassKg: fLo > 0 ? k / (2 * Math.PI * fLo) ** 2 : Infinity,
    },
  };
}
