/**
 * The damping relations of the site-record code against the textbook single-degree-of-freedom oscillator
 * (A. K. Chopra, Dynamics of Structures, ch. 2 "Free vibration" and ch. 3 "Response to harmonic excitations";
 * equations quoted from memory, the page not checked):
 *   free vibration u(t) = e^{−ζω_n t}[u₀ cos ω_D t + (u̇₀ + ζω_n u₀)/ω_D sin ω_D t], ω_D = ω_n√(1 − ζ²);
 *   logarithmic decrement δ = ln(u_i/u_{i+1}) = 2πζ/√(1 − ζ²), so ζ = δ/√(4π² + δ²) (≈ δ/2π for small ζ);
 *   half-power bandwidth ζ ≈ (f_b − f_a)/(2 f_n), where |H|² falls to half its peak.
 * The checks evaluate these closed forms, not the code under test, as the reference.
 */
import { describe, expect, it } from 'vitest';
import {
  dampingRatioFromHalfPower,
  dampingRatioFromLogarithmicDecrement,
  logarithmicDecrementFromDampingRatio,
  logarithmicDecrementFromPeaks,
} from '../../shared/engine/signal/formulas';

/** Chopra's free vibration of a damped SDOF system (from memory, see above). */
function freeVibration(t: number, frequencyHz: number, dampingRatio: number, u0: number, v0: number): number {
  const wn = 2 * Math.PI * frequencyHz;
  const wd = wn * Math.sqrt(1 - dampingRatio ** 2);
  return Math.exp(-dampingRatio * wn * t) * (u0 * Math.cos(wd * t) + ((v0 + dampingRatio * wn * u0) / wd) * Math.sin(wd * t));
}

/** Positive peaks of a sampled curve, refined by a parabola through each local maximum and its neighbours. */
function positivePeaks(f: (t: number) => number, durationS: number, stepS: number): number[] {
  const peaks: number[] = [];
  let a = f(0);
  let b = f(stepS);
  for (let t = 2 * stepS; t < durationS; t += stepS) {
    const c = f(t);
    if (b > a && b >= c && b > 0) {
      const curvature = a - 2 * b + c;
      const offset = (0.5 * (a - c)) / curvature;
      peaks.push(b - 0.25 * (a - c) * offset);
    }
    a = b;
    b = c;
  }
  return peaks;
}

describe('logarithmic decrement (Chopra ch. 2)', () => {
  it.each([0.002, 0.01, 0.05, 0.2])('successive peaks of a free vibration with ζ = %s give δ = 2πζ/√(1 − ζ²) and back ζ', (zeta) => {
    const peaks = positivePeaks((t) => freeVibration(t, 1.7, zeta, 0.01, 0.02), 6, 1e-4);
    expect(peaks.length).toBeGreaterThan(5);
    const delta = logarithmicDecrementFromPeaks(peaks[0], peaks[1]);
    expect(delta).toBeCloseTo(logarithmicDecrementFromDampingRatio(zeta), 6);
    expect(dampingRatioFromLogarithmicDecrement(delta)).toBeCloseTo(zeta, 7);
    // Over j cycles: δ = ln(u_i/u_{i+j}) / j.
    expect(logarithmicDecrementFromPeaks(peaks[0], peaks[5], 5)).toBeCloseTo(delta, 6);
  });

  it('ζ ≈ δ/2π for light damping, within ζ²·π (the first term left out)', () => {
    const zeta = 0.01;
    const delta = logarithmicDecrementFromDampingRatio(zeta);
    expect(Math.abs(delta / (2 * Math.PI) - zeta)).toBeLessThan(Math.PI * zeta ** 2);
  });
});

describe('half-power bandwidth (Chopra ch. 3)', () => {
  it.each([0.005, 0.01, 0.03])('the half-power points of |H(f)|² for ζ = %s give ζ to O(ζ²)', (zeta) => {
    const fn = 2.4;
    const power = (f: number) => {
      const r = f / fn;
      return 1 / ((1 - r * r) ** 2 + (2 * zeta * r) ** 2);
    };
    const peakHz = fn * Math.sqrt(1 - 2 * zeta * zeta);
    const half = power(peakHz) / 2;
    const bisect = (lo: number, hi: number) => {
      for (let i = 0; i < 200; i++) {
        const mid = (lo + hi) / 2;
        if (power(lo) - half > 0 === power(mid) - half > 0) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    };
    const lowerHz = bisect(fn * 0.5, peakHz);
    const upperHz = bisect(peakHz, fn * 1.5);
    // Exact: (f_{a,b}/f_n)² = 1 − 2ζ² ∓ 2ζ√(1 − ζ²) (Chopra ch. 3, from memory).
    expect(lowerHz).toBeCloseTo(fn * Math.sqrt(1 - 2 * zeta ** 2 - 2 * zeta * Math.sqrt(1 - zeta ** 2)), 9);
    expect(upperHz).toBeCloseTo(fn * Math.sqrt(1 - 2 * zeta ** 2 + 2 * zeta * Math.sqrt(1 - zeta ** 2)), 9);
    expect(Math.abs(dampingRatioFromHalfPower(lowerHz, upperHz, fn) / zeta - 1)).toBeLessThan(zeta);
  });
});
