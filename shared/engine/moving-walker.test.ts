import { describe, expect, it } from 'vitest';
import { simulateMovingWalker, resonantPacingFrequencyHz, type MovingWalkerHistory } from './moving-walker';

/** The steady state of a damped system: always a number. */
function steadyOf(h: MovingWalkerHistory): number {
  expect(h.steadyStatePeakAccelerationMPerS2).not.toBeNull();
  return h.steadyStatePeakAccelerationMPerS2 as number;
}

describe('moving walker', () => {
  it('on a long span the peak approaches the harmonic steady state at the antinode', () => {
    // Invented long span: a crossing of ~290 s against a build-up time 1/(ζω) of ~3 s.
    const structure = { modalMassKg: 90000, frequencyHz: 2.0, dampingRatio: 0.025 };
    const h = simulateMovingWalker(structure, [], { spanM: 440, pacingFrequencyHz: 2.0 });
    // Steady resonance of the first harmonic: α1 G / (2 ζ M) (Bachmann & Ammann α1 = 0.4, G = 800 N).
    expect(steadyOf(h)).toBeCloseTo((0.4 * 800) / (2 * 0.025 * 90000), 6);
    expect(h.peakAccelerationMPerS2 / steadyOf(h)).toBeGreaterThan(0.97);
    expect(h.peakAccelerationMPerS2 / steadyOf(h)).toBeLessThan(1.03);
    // A steady sine has r.m.s. = peak / √2.
    expect(h.maxRunningRms1sMPerS2 / (steadyOf(h) / Math.SQRT2)).toBeGreaterThan(0.96);
    expect(h.maxRunningRms1sMPerS2 / (steadyOf(h) / Math.SQRT2)).toBeLessThan(1.03);
  });

  it('on a short span the response stays well below the steady state (no time to build up)', () => {
    const structure = { modalMassKg: 20000, frequencyHz: 2.0, dampingRatio: 0.004 };
    const h = simulateMovingWalker(structure, [], { spanM: 20 });
    expect(h.peakAccelerationMPerS2).toBeLessThan(0.6 * steadyOf(h));
  });

  it('a tuned damper lowers the transient and reports its stroke', () => {
    const structure = { modalMassKg: 30000, frequencyHz: 2.1, dampingRatio: 0.004 };
    const bare = simulateMovingWalker(structure, [], { spanM: 60 });
    const damped = simulateMovingWalker(structure, [{ massKg: 900, frequencyHz: 2.04, dampingRatio: 0.1 }], { spanM: 60 });
    expect(damped.peakAccelerationMPerS2).toBeLessThan(0.7 * bare.peakAccelerationMPerS2);
    expect(damped.maxTmdStrokeM[0]).toBeGreaterThan(0);
  });

  it('undamped mode (ζ = 0): a finite history whose peak is the resonant build-up ω α1 G (L/v) / (π M)', () => {
    // Resonant build-up of an undamped mode under a slowly varying harmonic force F(t) sin ωt: the acceleration
    // amplitude grows as (ω / 2M) ∫ F dt (method of slowly varying amplitude, common practice). With
    // F(t) = α1 G sin(π v t / L) over the crossing, ∫ F dt = α1 G · 2L / (π v), so a = ω α1 G L / (π v M).
    // Bachmann & Ammann α1 = 0.4, G = 800 N; v = 0.75 m × 2 Hz. Invented span and mass.
    const structure = { modalMassKg: 30000, frequencyHz: 2.0, dampingRatio: 0 };
    const h = simulateMovingWalker(structure, [], { spanM: 60, pacingFrequencyHz: 2.0, trailingTimeS: 5 });
    const expected = (2 * Math.PI * 2.0 * 0.4 * 800 * 60) / (Math.PI * 1.5 * 30000);
    expect(h.structureAccelerationMPerS2.every(Number.isFinite)).toBe(true);
    expect(h.peakAccelerationMPerS2 / expected).toBeGreaterThan(0.99);
    expect(h.peakAccelerationMPerS2 / expected).toBeLessThan(1.01);
    // No damping: after the crossing the free vibration keeps its amplitude (energy conservation).
    const tail = h.structureAccelerationMPerS2.slice(-200).reduce((m, a) => Math.max(m, Math.abs(a)), 0);
    expect(tail / h.peakAccelerationMPerS2).toBeGreaterThan(0.99);
    // The steady state of the resonant harmonic is unbounded: reported as null, not as a number.
    expect(h.steadyStatePeakAccelerationMPerS2).toBeNull();
    expect(h.governingHarmonicFrequencyHz).toBe(2.0);
    // A damped damper on the undamped mode: a finite steady state and a smaller transient.
    const damped = simulateMovingWalker(structure, [{ massKg: 900, frequencyHz: 1.94, dampingRatio: 0.1 }], { spanM: 60, pacingFrequencyHz: 2.0 });
    expect(steadyOf(damped)).toBeGreaterThan(0);
    expect(damped.peakAccelerationMPerS2).toBeLessThan(0.3 * h.peakAccelerationMPerS2);
  });

  it('picks the pacing frequency that resonates a harmonic', () => {
    expect(resonantPacingFrequencyHz('walking', 2.0)).toBe(2.0);
    expect(resonantPacingFrequencyHz('walking', 4.0)).toBe(2.0);
  });
});
