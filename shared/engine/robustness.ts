/**
 * `robustness`: a map of the peak acceleration over structure-frequency factors (rows) × damper-damping factors
 * (columns). Row i moves the structure frequency to factor_i × f_s (modal mass and damping ratio unchanged);
 * column j scales every damper's damping ratio by factor_j (mass and frequency unchanged). Each cell is the
 * continuous peak of the load envelope (to better than 0.2 %); the coupled undamped natural frequencies, which do
 * not depend on damping, are computed once per row and serve as hints for every cell of the row.
 */

import type { TmdParameters } from './types';
import { buildLoadEnvelope, type SteadyLoadCase } from './loads/load-envelope';
import { coupledNaturalFrequenciesHz, createModeTmdKernel, findEnvelopePeak } from './loads/response-envelope';
import { setStructureFrequency } from './sizing';
import { frequencyRangeWarnings, type DesignStructure, type DesignWarning } from './design';

export interface RobustnessInput {
  structure: DesignStructure;
  tmds: readonly TmdParameters[];
  loadCase: SteadyLoadCase;
  structureFrequencyFactors: readonly number[];
  tmdDampingFactors: readonly number[];
}

export interface RobustnessResult {
  structureFrequencyFactors: number[];
  tmdDampingFactors: number[];
  peakAccelerationMPerS2: number[][];
  bareStructurePeakAccelerationMPerS2: number[];
  warnings: DesignWarning[];
}

export function mapRobustness(input: RobustnessInput): RobustnessResult {
  const { structure, tmds, loadCase } = input;
  const envelope = buildLoadEnvelope(structure, loadCase);
  const kernel = createModeTmdKernel(structure, tmds);
  const bareKernel = createModeTmdKernel(structure, []);
  const baseDamping = Float64Array.from(kernel.tmdDampingNsPerM);
  const n = kernel.tmdCount;
  const zs = structure.dampingRatio;
  const rows: number[][] = [];
  const bareRow: number[] = [];
  const warnings: DesignWarning[] = [];
  const [lo, hi] = envelope.structureFrequencyRangeHz;
  const factors = input.structureFrequencyFactors;
  const fMin = structure.frequencyHz * Math.min(...factors);
  const fMax = structure.frequencyHz * Math.max(...factors);
  if (fMin < lo || fMax > hi) {
    warnings.push(...frequencyRangeWarnings(fMin < lo ? fMin : fMax, envelope));
  }
  for (const sf of factors) {
    const fs = sf * structure.frequencyHz;
    setStructureFrequency(kernel, fs, zs);
    setStructureFrequency(bareKernel, fs, zs);
    const hints = coupledNaturalFrequenciesHz(kernel);
    bareRow.push(findEnvelopePeak(bareKernel, envelope.bands).value);
    const row: number[] = [];
    for (const df of input.tmdDampingFactors) {
      for (let j = 0; j < n; j++) kernel.tmdDampingNsPerM[j] = baseDamping[j] * df;
      row.push(findEnvelopePeak(kernel, envelope.bands, 'structureAcceleration', { hintsHz: hints }).value);
    }
    rows.push(row);
  }
  return {
    structureFrequencyFactors: [...factors],
    tmdDampingFactors: [...input.tmdDampingFactors],
    peakAccelerationMPerS2: rows,
    bareStructurePeakAccelerationMPerS2: bareRow,
    warnings,
  };
}
