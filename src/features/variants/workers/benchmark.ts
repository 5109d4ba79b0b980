/**
 * The live check's reference workload, timed where it runs (the browser's worker): a 400-point response curve with and
 * without the damper and a 51 × 51 robustness map (structure frequency ±15 % × damper damping 0.25–3 ×), each cell a
 * continuous peak search of the load envelope — the engine's `robustness` command. Not a test: a figure to report.
 */
import { buildVariantAssessRequest, tuneVariantDamper, type VariantComputeInput } from '../../../../shared/compute/variant';
import { designCommands } from '../../../../shared/compute/design-commands';
import type { AssessRequest } from '../../../../shared/contracts/compute-design';
import { buildLoadEnvelope, type SteadyLoadCase } from '../../../../shared/engine/loads/load-envelope';
import { mapRobustness } from '../../../../shared/engine/robustness';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem, evaluateStructureAccelerationPerN } from '../../../../shared/engine/response';

export interface BenchmarkFigures {
  curvePoints: number;
  mapCells: number;
  curveMs: number;
  mapMs: number;
  totalMs: number;
}

export function runLiveBenchmark(input: VariantComputeInput, loadCaseIndex: number): BenchmarkFigures {
  const tmd = tuneVariantDamper(input.mode, input.variant.massRatio, input.variant.tuning);
  const request = designCommands.assess.request.parse(buildVariantAssessRequest(input, loadCaseIndex, tmd)) as AssessRequest;
  if (request.loadCase.kind === 'moving-walker') throw new RangeError('loadCaseIndex: the benchmark needs a steady load case');
  const started = performance.now();
  const envelope = buildLoadEnvelope(request.structure, request.loadCase as SteadyLoadCase);
  const system = createModeTmdSystem(request.structure, [tmd]);
  const bare = createModeTmdSystem(request.structure, []);
  const point = createModeTmdPoint(system);
  const lo = Math.min(...envelope.bands.map((b) => b.loHz));
  const hi = Math.max(...envelope.bands.map((b) => b.hiHz));
  const curvePoints = 400;
  const withDamper = new Float64Array(curvePoints);
  const without = new Float64Array(curvePoints);
  const stroke = new Float64Array(curvePoints);
  for (let i = 0; i < curvePoints; i++) {
    const f = lo + ((hi - lo) * i) / (curvePoints - 1);
    evaluateModeTmdSystem(system, f, point);
    withDamper[i] = point.structureAccelerationMPerS2PerN;
    without[i] = evaluateStructureAccelerationPerN(bare, f);
    stroke[i] = point.tmdStrokeMPerN[0];
  }
  const afterCurve = performance.now();
  const structureFrequencyFactors = Array.from({ length: 51 }, (_, i) => 0.85 + (0.3 * i) / 50);
  const tmdDampingFactors = Array.from({ length: 51 }, (_, i) => 0.25 + (2.75 * i) / 50);
  const map = mapRobustness({ structure: request.structure, tmds: [tmd], loadCase: request.loadCase as SteadyLoadCase, structureFrequencyFactors, tmdDampingFactors });
  const done = performance.now();
  if (map.peakAccelerationMPerS2.length !== 51 || !(withDamper[0] >= 0 && without[0] >= 0 && stroke[0] >= 0)) throw new Error('benchmark: unexpected shape');
  return { curvePoints, mapCells: 51 * 51, curveMs: afterCurve - started, mapMs: done - afterCurve, totalMs: done - started };
}
