/**
 * Re-tuning a damper to the structure as measured on site. The tuning method gives the damper frequency for the
 * measured structure (f_a = ratio(μ, ζ_s) · f_s); the damper is then brought there either by its springs at the same
 * moving mass, k' = m (2π f_a)² = k (f_a/f)², or by its mass at the same springs, m' = k / (2π f_a)² = m (f/f_a)²
 * (single-DOF oscillator f = √(k/m) / 2π: any dynamics handbook). A tuning range ±r about the damper's present
 * frequency says whether the change can be made on the unit as built.
 */
import { checkPositive, EngineInputError } from './linalg';
import { tuneTmd } from './tuning';
import type { TuningMethod } from './types';

export interface RetuneInput {
  /** Measured natural frequency of the structure mode, Hz. */
  structureFrequencyHz: number;
  /** Measured damping ratio of the structure mode (used by the methods for a damped structure). */
  structureDampingRatio: number;
  massRatio: number;
  method: TuningMethod;
  /** Moving mass of the damper as built, kg. */
  tmdMassKg?: number;
  /** Spring rate of the damper as built, N/m. */
  springRateNPerM?: number;
  /** Adjustment the unit allows, as a fraction of its present frequency (0.1 = ±10 %). */
  tuningRangeRatio?: number;
}

export interface RetuneResult {
  method: TuningMethod;
  massRatio: number;
  frequencyRatio: number;
  /** Damper frequency the method gives for the measured structure. */
  targetFrequencyHz: number;
  targetDampingRatio: number;
  /** Present damper frequency √(k/m)/2π, when both are given. */
  currentFrequencyHz: number | null;
  /** k' at the same mass (needs tmdMassKg). */
  springRateAtSameMassNPerM: number | null;
  springRateChangeRatio: number | null;
  /** m' at the same springs (needs springRateNPerM). */
  massAtSameSpringsKg: number | null;
  massChangeRatio: number | null;
  /** f_a / f − 1, when the present frequency is known. */
  frequencyChangeRatio: number | null;
  tuningRangeRatio: number | null;
  /** Whether |f_a/f − 1| ≤ r; null without both a present frequency and a range. */
  withinTuningRange: boolean | null;
}

export function retuneDamper(input: RetuneInput): RetuneResult {
  const { structureFrequencyHz, structureDampingRatio, massRatio, method, tmdMassKg, springRateNPerM, tuningRangeRatio } = input;
  if (tmdMassKg !== undefined) checkPositive(tmdMassKg, 'tmdMassKg');
  if (springRateNPerM !== undefined) checkPositive(springRateNPerM, 'springRateNPerM');
  if (tuningRangeRatio !== undefined && !(Number.isFinite(tuningRangeRatio) && tuningRangeRatio >= 0 && tuningRangeRatio < 1)) {
    throw new EngineInputError('tuningRangeRatio', `tuningRangeRatio: must be a fraction from 0 to below 1 (got ${tuningRangeRatio})`);
  }
  const tuned = tuneTmd(method, massRatio, structureFrequencyHz, structureDampingRatio);
  const target = tuned.tmdFrequencyHz;
  const omegaTarget = 2 * Math.PI * target;
  const currentFrequencyHz = tmdMassKg !== undefined && springRateNPerM !== undefined ? Math.sqrt(springRateNPerM / tmdMassKg) / (2 * Math.PI) : null;
  const springRateAtSameMassNPerM = tmdMassKg !== undefined ? tmdMassKg * omegaTarget * omegaTarget : null;
  const massAtSameSpringsKg = springRateNPerM !== undefined ? springRateNPerM / (omegaTarget * omegaTarget) : null;
  const frequencyChangeRatio = currentFrequencyHz === null ? null : target / currentFrequencyHz - 1;
  return {
    method,
    massRatio,
    frequencyRatio: tuned.frequencyRatio,
    targetFrequencyHz: target,
    targetDampingRatio: tuned.tmdDampingRatio,
    currentFrequencyHz,
    springRateAtSameMassNPerM,
    springRateChangeRatio: springRateAtSameMassNPerM !== null && springRateNPerM !== undefined ? springRateAtSameMassNPerM / springRateNPerM - 1 : null,
    massAtSameSpringsKg,
    massChangeRatio: massAtSameSpringsKg !== null && tmdMassKg !== undefined ? massAtSameSpringsKg / tmdMassKg - 1 : null,
    frequencyChangeRatio,
    tuningRangeRatio: tuningRangeRatio ?? null,
    withinTuningRange: frequencyChangeRatio === null || tuningRangeRatio === undefined ? null : Math.abs(frequencyChangeRatio) <= tuningRangeRatio + 1e-12,
  };
}
