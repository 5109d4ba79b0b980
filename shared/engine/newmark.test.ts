import { describe, expect, it } from 'vitest';
import { integrateNewmark } from './newmark';
import { solveFreeVibration } from './free-vibration';
import { randomChain, seededRandom } from './test-fixtures';

const flat = (a: number[][]) => Float64Array.from(a.flat());

describe('integrateNewmark (average acceleration)', () => {
  it('follows the exact modal free vibration of an undamped chain (error O(Δt²))', () => {
    const random = seededRandom(17);
    const { massKg, stiffnessNPerM } = randomChain(5, random);
    const x0 = Float64Array.from([0.01, 0.004, -0.003, 0.002, 0.006]);
    const v0 = Float64Array.from([0, 0.02, 0, -0.01, 0.03]);
    const errors: number[] = [];
    for (const dt of [2e-3, 1e-3]) {
      const steps = Math.round(2 / dt);
      const result = integrateNewmark({
        dofCount: 5,
        massKg: flat(massKg),
        dampingNsPerM: new Float64Array(25),
        stiffnessNPerM: flat(stiffnessNPerM),
        timeStepS: dt,
        stepCount: steps,
        initialDisplacementM: x0,
        initialVelocityMPerS: v0,
        force: () => {},
      });
      const exact = solveFreeVibration({ massKg, stiffnessNPerM, initialDisplacementM: x0, initialVelocityMPerS: v0, timesS: result.timesS });
      let error = 0;
      let scale = 0;
      for (let i = 0; i < exact.displacementM.length; i++) {
        error = Math.max(error, Math.abs(result.displacementM[i] - exact.displacementM[i]));
        scale = Math.max(scale, Math.abs(exact.displacementM[i]));
      }
      errors.push(error / scale);
    }
    expect(errors[1]).toBeLessThan(0.01);
    // Second order: halving Δt divides the error by about 4.
    expect(errors[0] / errors[1]).toBeGreaterThan(3.5);
    expect(errors[0] / errors[1]).toBeLessThan(4.5);
  });

  it('conserves the energy of an undamped free vibration exactly (average acceleration is energy-conserving)', () => {
    // A property of the trapezoidal rule on linear undamped systems (Hughes, The Finite Element Method, 1987; from
    // memory): ½ vᵀMv + ½ xᵀKx is constant to rounding, whatever the time step.
    const random = seededRandom(29);
    const { massKg, stiffnessNPerM } = randomChain(6, random);
    const m = flat(massKg);
    const k = flat(stiffnessNPerM);
    const result = integrateNewmark({
      dofCount: 6,
      massKg: m,
      dampingNsPerM: new Float64Array(36),
      stiffnessNPerM: k,
      timeStepS: 0.02, // coarse on purpose: several modes have ωΔt > 1
      stepCount: 3000,
      initialDisplacementM: Float64Array.from([0.01, -0.02, 0.015, 0, 0.005, -0.01]),
      force: () => {},
    });
    const energy = (step: number) => {
      let e = 0;
      for (let i = 0; i < 6; i++) {
        for (let j = 0; j < 6; j++) {
          e += 0.5 * result.velocityMPerS[step * 6 + i] * m[i * 6 + j] * result.velocityMPerS[step * 6 + j];
          e += 0.5 * result.displacementM[step * 6 + i] * k[i * 6 + j] * result.displacementM[step * 6 + j];
        }
      }
      return e;
    };
    const e0 = energy(0);
    for (let step = 0; step <= 3000; step += 100) expect(Math.abs(energy(step) / e0 - 1)).toBeLessThan(1e-10);
  });

  it('builds up an undamped single-DOF resonance as F/(2k) (sin ωt − ωt cos ωt)', () => {
    // Closed form of the undamped oscillator driven at resonance from rest (Chopra, Dynamics of Structures, chapter 3; from memory).
    const m = 800;
    const k = 1.4e5;
    const omega = Math.sqrt(k / m);
    const forceN = 250;
    const dt = (2 * Math.PI) / omega / 200;
    const steps = 200 * 20;
    const result = integrateNewmark({
      dofCount: 1,
      massKg: Float64Array.of(m),
      dampingNsPerM: Float64Array.of(0),
      stiffnessNPerM: Float64Array.of(k),
      timeStepS: dt,
      stepCount: steps,
      force: (t, out) => {
        out[0] = forceN * Math.sin(omega * t);
      },
    });
    let error = 0;
    let scale = 0;
    for (let s = 0; s <= steps; s++) {
      const t = result.timesS[s];
      const exact = (forceN / (2 * k)) * (Math.sin(omega * t) - omega * t * Math.cos(omega * t));
      error = Math.max(error, Math.abs(result.displacementM[s] - exact));
      scale = Math.max(scale, Math.abs(exact));
    }
    // Average acceleration lengthens the period by (ωΔt)²/12 (Chopra, Dynamics of Structures, chapter 5; from memory): after 20 periods the phase lags by
    // 20 · 2π · (ωΔt)²/12 ≈ 0.0103 rad, which bounds the relative error of the growing response.
    const phaseLag = 20 * 2 * Math.PI * ((omega * dt) ** 2 / 12);
    expect(error / scale).toBeLessThan(phaseLag);
    expect(error / scale).toBeGreaterThan(0.2 * phaseLag);
  });

  it('reaches the damped resonant amplitude F/(2ζK) (single-DOF closed form)', () => {
    // Steady-state amplitude of a damped oscillator driven at ω_n (Chopra, Dynamics of Structures, chapter 3; from memory).
    const m = 1000;
    const k = 1.6e5;
    const zeta = 0.02;
    const omega = Math.sqrt(k / m);
    const c = 2 * zeta * m * omega;
    const forceN = 100;
    const dt = (2 * Math.PI) / omega / 100;
    const steps = 100 * 300; // 300 periods: the transient has decayed by e^(−2π·0.02·300)
    const result = integrateNewmark({
      dofCount: 1,
      massKg: Float64Array.of(m),
      dampingNsPerM: Float64Array.of(c),
      stiffnessNPerM: Float64Array.of(k),
      timeStepS: dt,
      stepCount: steps,
      force: (t, out) => {
        out[0] = forceN * Math.cos(omega * t);
      },
    });
    let amplitude = 0;
    for (let s = steps - 200; s <= steps; s++) amplitude = Math.max(amplitude, Math.abs(result.displacementM[s]));
    // Newmark's period elongation is O((ωΔt)²/12) ≈ 0.3 % here, which at resonance lowers the amplitude a little.
    expect(amplitude / (forceN / (2 * zeta * k))).toBeGreaterThan(0.98);
    expect(amplitude / (forceN / (2 * zeta * k))).toBeLessThan(1.001);
  });

  it('refuses a non-positive time step', () => {
    expect(() =>
      integrateNewmark({ dofCount: 1, massKg: Float64Array.of(1), dampingNsPerM: Float64Array.of(0), stiffnessNPerM: Float64Array.of(1), timeStepS: 0, stepCount: 3, force: () => {} }),
    ).toThrow(/timeStepS: must be a finite number greater than 0/);
  });
});
