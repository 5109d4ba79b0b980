/**
 * `robustness`: a map of the peak acceleration over structure-frequency factors (rows) × damper-damping factors
 * (columns). Row i moves the structure frequency to factor_i × f_s (modal mass and damping ratio unchanged);
 * column j scales every damper's damping ratio by factor_j (mass and frequency unchanged). Each cell is the
 * continuous peak of the load envelope (to better than 0.2 %). One engine system is built per row (its coupled
 * undamped frequencies do not depend on damping); the cells of the row are searched by the acceleration-envelope
 * kernel with the dampers' damping coefficients scaled by the column's factor, with nothing allocated per cell.
 */

import type { TmdParameters } from './types';
import type { RobustnessResponse } from '../contracts/compute-design';
import { buildLoadEnvelope, type SteadyLoadCase } from './loads/load-envelope';
import { findEnvelopePeak, unboundedBareFrequencyHz } from './loads/response-envelope';
import { createModeTmdSystem } from './response';
import { accelerationEnvelopeKernel, type EnvelopeKernelPeak } from './acceleration-envelope';
import { bareUnboundedWarning, frequencyRangeWarnings, refuseUnboundedResponse, type DesignStructure, type DesignWarning } from './design';

export interface RobustnessInput {
  structure: DesignStructure;
  tmds: readonly TmdParameters[];
  loadCase: SteadyLoadCase;
  structureFrequencyFactors: readonly number[];
  tmdDampingFactors: readonly number[];
}

/** The answer of `robustness`: the type of its contract (compute-design.ts). */
export type RobustnessResult = RobustnessResponse;

export function mapRobustness(input: RobustnessInput): RobustnessResult {
  const { structure, tmds, loadCase } = input;
  const envelope = buildLoadEnvelope(structure, loadCase);
  const zs = structure.dampingRatio;
  const rows: number[][] = [];
  const bareRow: Array<number | null> = [];
  let unboundedRows = 0;
  let firstUnboundedHz = 0;
  // Which field leaves a cell without any damping (structure ζ = 0): the dampers' own ratios, or a factor of 0.
  const allTmdsUndamped = tmds.every((t) => t.dampingRatio === 0);
  const warnings: DesignWarning[] = [...envelope.warnings];
  const kernel = accelerationEnvelopeKernel(envelope.bands, tmds.length);
  const cell: EnvelopeKernelPeak = { value: 0, frequencyHz: 0, bandIndex: 0 };
  // With ζ_s = 0, a column of factor 0 (or dampers all undamped) leaves a cell without any damping.
  const someCellUndamped = zs === 0 && (allTmdsUndamped || input.tmdDampingFactors.some((df) => df === 0));
  const [lo, hi] = envelope.structureFrequencyRangeHz;
  const factors = input.structureFrequencyFactors;
  const fMin = structure.frequencyHz * Math.min(...factors);
  const fMax = structure.frequencyHz * Math.max(...factors);
  if (fMin < lo || fMax > hi) {
    warnings.push(...frequencyRangeWarnings(fMin < lo ? fMin : fMax, envelope));
  }
  for (const sf of factors) {
    const rowStructure = { ...structure, frequencyHz: sf * structure.frequencyHz };
    const fs = rowStructure.frequencyHz;
    if (zs === 0 && unboundedBareFrequencyHz(envelope.bands, [fs, fs]) !== null) {
      if (unboundedRows++ === 0) firstUnboundedHz = fs;
      bareRow.push(null);
    } else {
      bareRow.push(findEnvelopePeak(createModeTmdSystem(rowStructure, []), envelope.bands).value);
    }
    const dampingFactors = input.tmdDampingFactors;
    const row: number[] = new Array(dampingFactors.length);
    kernel.setSystem(createModeTmdSystem(rowStructure, tmds));
    if (!someCellUndamped) {
      kernel.peaks(dampingFactors, row);
      rows.push(row);
      continue;
    }
    for (let column = 0; column < dampingFactors.length; column++) {
      const df = dampingFactors[column];
      if (zs === 0 && (df === 0 || allTmdsUndamped)) {
        // Nothing damped in this cell: refused where a resonance is loaded, else the envelope's own undamped search.
        const system = createModeTmdSystem(rowStructure, tmds.map((t) => ({ ...t, dampingRatio: t.dampingRatio * df })));
        if (allTmdsUndamped) {
          refuseUnboundedResponse(system, envelope.bands, 'tmds.0.dampingRatio', `is 0, as are the damping ratios of the structure and of every other damper (structure frequency factor ${sf})`);
        } else {
          refuseUnboundedResponse(system, envelope.bands, `tmdDampingFactors.${column}`, `is 0, which leaves every damper undamped on a structure with a damping ratio of 0 (structure frequency factor ${sf})`);
        }
        row[column] = findEnvelopePeak(system, envelope.bands).value;
        continue;
      }
      row[column] = kernel.peak(df, cell).value;
    }
    rows.push(row);
  }
  if (unboundedRows > 0) {
    const w = bareUnboundedWarning(firstUnboundedHz);
    w.message += unboundedRows > 1 ? ` (${unboundedRows} rows of the map, the first at ${firstUnboundedHz.toPrecision(4)} Hz)` : '';
    warnings.push(w);
  }
  return {
    structureFrequencyFactors: [...factors],
    tmdDampingFactors: [...input.tmdDampingFactors],
    peakAccelerationMPerS2: rows,
    bareStructurePeakAccelerationMPerS2: bareRow,
    warnings,
  };
}
