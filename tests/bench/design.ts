/**
 * Design benchmarks: `size` with a ±10 % structure-frequency tolerance, the 101 × 101 robustness map in process, and
 * the live tuning of a tuning variant (a 400-point response curve plus a 51 × 51 map, recomputed per change).
 * Inputs are invented numbers for timing only.
 */
import { sizeDamper } from '../../shared/engine/sizing';
import { mapRobustness } from '../../shared/engine/robustness';
import { assessDesign } from '../../shared/engine/design';
import { tuneTmd } from '../../shared/engine/tuning';
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem } from '../../shared/engine/response';
import { report, timeIt } from './engine';

export const benchStructure = { modalMassKg: 42000, frequencyHz: 1.95, dampingRatio: 0.006, direction: 'vertical' as const };
export const benchLoadCase = { kind: 'crowd' as const, guide: 'hivoss' as const, densityPerM2: 0.5, deckAreaM2: 180 };
const tuned = tuneTmd('den-hartog', 0.02, benchStructure.frequencyHz);
const tmd = { massKg: 840, frequencyHz: tuned.tmdFrequencyHz, dampingRatio: tuned.tmdDampingRatio };

function mapRequest(size: number) {
  return {
    structure: benchStructure,
    tmds: [tmd],
    loadCase: benchLoadCase,
    structureFrequencyFactors: Array.from({ length: size }, (_, i) => 0.85 + (0.3 * i) / (size - 1)),
    tmdDampingFactors: Array.from({ length: size }, (_, i) => (2.5 * i) / (size - 1)),
  };
}

/** The request of the 101 × 101 map, also used by the calc-process benchmark. */
export const robustnessRequest = mapRequest(101);

export function runDesignBenchmarks(): void {
  console.log('Design');
  report('assess, crowd (HiVoSS), 1 damper, criteria', timeIt(() => assessDesign({ structure: benchStructure, tmds: [tmd], loadCase: benchLoadCase, criteria: { set: 'hivoss', class: 'CL1' } }), 200));
  for (const method of ['den-hartog', 'ioi-ikeda', 'hinf', 'h2'] as const) {
    const run = () => sizeDamper({ structure: benchStructure, method, loadCase: benchLoadCase, peakAccelerationLimitMPerS2: 0.5, structureFrequencyToleranceRatio: 0.1 });
    const answer = run();
    report(`size ±10 %, ${method} (μ = ${(100 * answer.massRatio).toFixed(2)} %, ${answer.evaluations} trials)`, timeIt(run, 20), 50);
  }
  const coldStart = performance.now();
  mapRobustness(robustnessRequest);
  const coldMs = performance.now() - coldStart;
  report('robustness map 101 × 101, in process', timeIt(() => mapRobustness(robustnessRequest), 30), 10);
  console.log(`  (its first run in this process, before the JIT has optimised it: ${coldMs.toFixed(1)} ms)`);

  // Live tuning of a tuning variant: every change of mass, frequency or damping redraws the response curve with and
  // without the damper (400 frequencies) and the 51 × 51 robustness map around the new tuning.
  const liveMap = mapRequest(51);
  const curveHz = Float64Array.from({ length: 400 }, (_, i) => 1.25 + (1.05 * i) / 399);
  const curve = new Float64Array(800);
  let step = 0;
  report('live tuning: 400-point curve + 51 × 51 map, per change', timeIt(() => {
    step = (step + 1) % 20;
    const changed = { ...tmd, frequencyHz: tmd.frequencyHz * (0.99 + 0.001 * step), dampingRatio: tmd.dampingRatio * (0.9 + 0.01 * step) };
    const withDamper = createModeTmdSystem(benchStructure, [changed]);
    const bare = createModeTmdSystem(benchStructure, []);
    const point = createModeTmdPoint(withDamper);
    const barePoint = createModeTmdPoint(bare);
    for (let i = 0; i < curveHz.length; i++) {
      curve[i] = evaluateModeTmdSystem(withDamper, curveHz[i], point).structureAccelerationMPerS2PerN;
      curve[400 + i] = evaluateModeTmdSystem(bare, curveHz[i], barePoint).structureAccelerationMPerS2PerN;
    }
    return mapRobustness({ ...liveMap, tmds: [changed] });
  }, 60), 16);
}
