import { describe, expect, it } from 'vitest';
import { simulateMovingWalker, resonantPacingFrequencyHz } from './moving-walker';

describe('moving walker', () => {
  it('on a long span the peak approaches the harmonic steady state at the antinode', () => {
    // Invented long span: a crossing of ~290 s against a build-up time 1/(ζω) of ~3 s.
    const structure = { modalMassKg: 90000, frequencyHz: 2.0, dampingRatio: 0.025 };
    const h = simulateMovingWalker(structure, [], { spanM: 440, pacingFrequencyHz: 2.0 });
    // Steady resonance of the first harmonic: α1 G / (2 ζ M) (Bachmann & Ammann α1 = 0.4, G = 800 N).
    expect(h.steadyStatePeakAccelerationMPerS2).toBeCloseTo((0.4 * 800) / (2 * 0.025 * 90000), 6);
    expect(h.peakAccelerationMPerS2 / h.steadyStatePeakAccelerationMPerS2).toBeGreaterThan(0.97);
    expect(h.peakAccelerationMPerS2 / h.steadyStatePeakAccelerationMPerS2).toBeLessThan(1.03);
    // A steady sine has r.m.s. = peak / √2.
    expect(h.maxRunningRms1sMPerS2 / (h.steadyStatePeakAccelerationMPerS2 / Math.SQRT2)).toBeGreaterThan(0.96);
    expect(h.maxRunningRms1sMPerS2 / (h.steadyStatePeakAccelerationMPerS2 / Math.SQRT2)).toBeLessThan(1.03);
  });

  it('on a short span the response stays well below the steady state (no time to build up)', () => {
    const structure = { modalMassKg: 20000, frequencyHz: 2.0, dampingRatio: 0.004 };
    const h = simulateMovingWalker(structure, [], { spanM: 20 });
    expect(h.peakAccelerationMPerS2).toBeLessThan(0.6 * h.steadyStatePeakAccelerationMPerS2);
  });

  it('a tuned damper lowers the transient and reports its stroke', () => {
    const structure = { modalMassKg: 30000, frequencyHz: 2.1, dampingRatio: 0.004 };
    const bare = simulateMovingWalker(structure, [], { spanM: 60 });
    const damped = simulateMovingWalker(structure, [{ massKg: 900, frequencyHz: 2.04, dampingRatio: 0.1 }], { spanM: 60 });
    expect(damped.peakAccelerationMPerS2).toBeLessThan(0.7 * bare.peakAccelerationMPerS2);
    expect(damped.maxTmdStrokeM[0]).toBeGreaterThan(0);
  });

  it('picks the pacing frequency that resonates a harmonic', () => {
    expect(resonantPacingFrequencyHz('walking', 2.0)).toBe(2.0);
    expect(resonantPacingFrequencyHz('walking', 4.0)).toBe(2.0);
  });
});
