/**
 * Synthetic site records with a known frequency and damping, for tests and the seed's invented demo records: a
 * single-DOF oscillator ẍ + 2ζωẋ + ω²x = p(t) integrated exactly for a force held constant over each sample (zero-order hold), and its
 * free decay in closed form (Chopra, Dynamics of Structures, ch. 2, from memory).
 */
import { seededRandom } from '../test-fixtures';

/** Standard normal deviates from a seeded uniform generator (Box–Muller). */
export function seededNormal(seed: number): () => number {
  const uniform = seededRandom(seed);
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const value = spare;
      spare = null;
      return value;
    }
    const u = 1 - uniform();
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
}

export interface OscillatorRecord {
  frequencyHz: number;
  dampingRatio: number;
  sampleRateHz: number;
}

/**
 * Acceleration of the oscillator driven by white noise (force per unit mass with standard deviation `forceStd`,
 * constant over each sample), exact between samples. A warm-up of 20 decay times is discarded so that the record is
 * stationary. `noiseStd` adds white measurement noise.
 */
export function ambientRecord(
  { frequencyHz, dampingRatio, sampleRateHz }: OscillatorRecord,
  durationS: number,
  seed: number,
  { forceStd = 1, noiseStd = 0 } = {},
): Float64Array {
  const normal = seededNormal(seed);
  const omega = 2 * Math.PI * frequencyHz;
  const sigma = dampingRatio * omega;
  const omegaD = omega * Math.sqrt(1 - dampingRatio * dampingRatio);
  const dt = 1 / sampleRateHz;
  const e = Math.exp(-sigma * dt);
  const c = Math.cos(omegaD * dt);
  const s = Math.sin(omegaD * dt);
  const n = Math.round(durationS * sampleRateHz);
  const warmUp = Math.ceil((20 / sigma) * sampleRateHz);
  const out = new Float64Array(n);
  let x = 0;
  let v = 0;
  for (let i = -warmUp; i < n; i++) {
    const p = forceStd * normal();
    if (i >= 0) out[i] = p - 2 * sigma * v - omega * omega * x + noiseStd * normal();
    // Exact step: x = p/ω² + free response of (x − p/ω², v).
    const xs = p / (omega * omega);
    const x0 = x - xs;
    const nextX = xs + e * (x0 * c + ((v + sigma * x0) / omegaD) * s);
    const nextV = e * (v * c - ((omega * omega * x0 + sigma * v) / omegaD) * s);
    x = nextX;
    v = nextV;
  }
  return out;
}

/**
 * Acceleration of the free decay from x(0) = 0, ẋ(0) = v₀ (a heel drop's impulse), after `quietS` seconds of
 * nothing, with white measurement noise: a(t) = −v₀ e^{−σt}(2σ cos ω_d t + (ω_d − σ²/ω_d) sin ω_d t).
 */
export function decayRecord(
  { frequencyHz, dampingRatio, sampleRateHz }: OscillatorRecord,
  durationS: number,
  seed: number,
  { initialVelocityMPerS = 0.01, noiseStd = 0, quietS = 0 } = {},
): Float64Array {
  const normal = seededNormal(seed);
  const omega = 2 * Math.PI * frequencyHz;
  const sigma = dampingRatio * omega;
  const omegaD = omega * Math.sqrt(1 - dampingRatio * dampingRatio);
  const n = Math.round(durationS * sampleRateHz);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = i / sampleRateHz - quietS;
    const signal =
      t < 0 ? 0 : -initialVelocityMPerS * Math.exp(-sigma * t) * (2 * sigma * Math.cos(omegaD * t) + (omegaD - (sigma * sigma) / omegaD) * Math.sin(omegaD * t));
    out[i] = signal + noiseStd * normal();
  }
  return out;
}
