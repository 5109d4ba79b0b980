/**
 * Engine benchmarks: median wall time of repeated runs after warm-up, printed with the target for this machine.
 * Inputs are invented numbers for timing only.
 */
import { createModeTmdPoint, createModeTmdSystem, evaluateModeTmdSystem, findResponsePeak } from '../../shared/engine/response';
import { tuneTmd } from '../../shared/engine/tuning';
import { solveModes } from '../../shared/engine/modal';
import { integrateNewmark } from '../../shared/engine/newmark';
import { buildModeTmdMatrices } from '../../shared/engine/matrices';

export interface Timing {
  medianMs: number;
  minMs: number;
  /** Median processor time of the process during a run (user + system): less sensitive than the wall time to other work on a shared machine. */
  cpuMedianMs?: number;
}

export function timeIt(run: () => unknown, repeats: number, warmUp = Math.max(3, Math.ceil(repeats / 5))): Timing {
  for (let i = 0; i < warmUp; i++) run();
  const times: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const cpuStart = process.cpuUsage();
    const start = performance.now();
    run();
    times.push(performance.now() - start);
    const used = process.cpuUsage(cpuStart);
    cpu.push((used.user + used.system) / 1000);
  }
  times.sort((a, b) => a - b);
  cpu.sort((a, b) => a - b);
  return { medianMs: times[Math.floor(times.length / 2)], minMs: times[0], cpuMedianMs: cpu[Math.floor(cpu.length / 2)] };
}

function formatMs(ms: number): string {
  return ms < 0.1 ? `${(ms * 1000).toFixed(2).padStart(9)} µs` : `${ms.toFixed(3).padStart(9)} ms`;
}

export function report(label: string, result: Timing, targetMs?: number): void {
  const verdict = targetMs === undefined ? '' : result.medianMs <= targetMs ? `  (target ≤ ${targetMs} ms: met)` : `  (target ≤ ${targetMs} ms: MISSED)`;
  // The processor time is shown where a run is long enough for the clock's resolution (1 µs … a few ms).
  const cpu = result.cpuMedianMs !== undefined && result.medianMs >= 1 ? `   cpu ${formatMs(result.cpuMedianMs)}` : '';
  console.log(`${label.padEnd(58)} median ${formatMs(result.medianMs)}   min ${formatMs(result.minMs)}${cpu}${verdict}`);
}

export function runEngineBenchmarks(): void {
  console.log('Engine');
  // 1 + 1 DOF response at 10,000 frequencies.
  const system = createModeTmdSystem({ modalMassKg: 42000, frequencyHz: 2.05, dampingRatio: 0.005 }, [{ massKg: 840, frequencyHz: 2.0, dampingRatio: 0.085 }]);
  const point = createModeTmdPoint(system);
  const frequencies = Float64Array.from({ length: 10000 }, (_, i) => 0.5 + (i * 4) / 9999);
  const accelerations = new Float64Array(10000);
  report(
    'response, 1+1 DOF, 10,000 frequencies',
    timeIt(() => {
      for (let i = 0; i < frequencies.length; i++) accelerations[i] = evaluateModeTmdSystem(system, frequencies[i], point).structureAccelerationMPerS2PerN;
    }, 200),
    2,
  );
  report('continuous peak search, 1+1 DOF (create + search)', timeIt(() => {
    const s = createModeTmdSystem({ modalMassKg: 42000, frequencyHz: 2.05, dampingRatio: 0.005 }, [{ massKg: 840, frequencyHz: 2.0, dampingRatio: 0.085 }]);
    findResponsePeak(s, [1.2, 3.2]);
  }, 2000));
  report('tuning, hinf (μ = 0.02, ζ_s = 0.005)', timeIt(() => tuneTmd('hinf', 0.02, 2.05, 0.005), 50), 5);
  report('tuning, hinf (μ = 0.01, ζ_s = 0)', timeIt(() => tuneTmd('hinf', 0.01, 2.05, 0), 50), 5);
  report('tuning, h2 (μ = 0.02, ζ_s = 0.005)', timeIt(() => tuneTmd('h2', 0.02, 2.05, 0.005), 50));

  // 200-DOF modes: a chain of masses and springs fixed at one end (deterministic numbers).
  const n = 200;
  const mass = new Float64Array(n * n);
  const stiffness = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    mass[i * n + i] = 500 + 300 * Math.sin(i);
    const spring = 2e6 * (1 + 0.5 * Math.cos(0.3 * i));
    stiffness[i * n + i] += spring;
    if (i > 0) {
      stiffness[(i - 1) * n + i - 1] += spring;
      stiffness[(i - 1) * n + i] -= spring;
      stiffness[i * n + i - 1] -= spring;
    }
  }
  report('modes, 200 DOF', timeIt(() => solveModes(mass, stiffness, n), 10), 100);

  // 60 s of Newmark integration at 200 Hz for 10 DOF: one mode with nine dampers under a harmonic force.
  const tmds = Array.from({ length: 9 }, (_, j) => ({ massKg: 90, frequencyHz: 1.9 + 0.025 * j, dampingRatio: 0.06 }));
  const matrices = buildModeTmdMatrices({ modalMassKg: 38000, frequencyHz: 2.0, dampingRatio: 0.006 }, tmds);
  const omega = 2 * Math.PI * 2.0;
  report(
    'Newmark, 10 DOF, 60 s at 200 Hz (12,000 steps)',
    timeIt(
      () =>
        integrateNewmark({
          ...matrices,
          timeStepS: 1 / 200,
          stepCount: 12000,
          force: (t, out) => {
            out[0] = 280 * Math.sin(omega * t);
          },
        }),
      20,
    ),
    20,
  );
}
