import { describe, expect, it } from 'vitest';
import { designBandPass, filterZeroPhase, zeroPhaseGain } from './filter';

describe('zero-phase Butterworth band-pass', () => {
  const fs = 100;
  const filter = designBandPass(1.6, 2.4, fs);

  it('has the Butterworth half-power point at each edge (forward-backward amplitude gain |H|² = ½) and passes the middle', () => {
    // Butterworth: |H(f_c)|² = 1/2 at the cut-off (common practice); forward and backward, the amplitude is scaled
    // by |H|². A wide band, so that the other edge's filter hardly acts.
    const wide = designBandPass(0.5, 10, fs);
    expect(zeroPhaseGain(wide, 0.5, fs)).toBeCloseTo(0.5, 3);
    expect(zeroPhaseGain(wide, 10, fs)).toBeCloseTo(0.5, 2);
    expect(zeroPhaseGain(wide, Math.sqrt(5), fs)).toBeCloseTo(1, 3);
    // 4th order: |H|² = 1/(1 + (f_c/f)⁸) for the high-pass; an octave below, 1/257 (then squared: forward and backward).
    expect(zeroPhaseGain(wide, 0.25, fs)).toBeCloseTo(1 / 257, 4);
  });

  it('does not shift the phase of a sine in the pass band and scales it by the gain', () => {
    const n = 6000;
    const f = 2.1;
    const x = Float64Array.from({ length: n }, (_, i) => Math.sin((2 * Math.PI * f * i) / fs));
    const y = filterZeroPhase(filter, x, fs);
    const gain = zeroPhaseGain(filter, f, fs);
    for (let i = 2000; i < 4000; i += 13) expect(y[i]).toBeCloseTo(gain * x[i], 4);
  });

  it('keeps the decay rate and frequency of a decaying oscillation (an eigenfunction of the filter) after its transient', () => {
    const n = 4000;
    const sigma = 0.15;
    const omega = 2 * Math.PI * 2;
    const x = Float64Array.from({ length: n }, (_, i) => Math.exp((-sigma * i) / fs) * Math.cos((omega * i) / fs));
    const y = filterZeroPhase(filter, x, fs);
    // Ratio of the filtered to the input over one period later: e^{−σT} the same.
    const i0 = 1000;
    const period = Math.round(fs / 2);
    expect(y[i0 + period] / y[i0]).toBeCloseTo(x[i0 + period] / x[i0], 4);
  });

  it('refuses a band outside (0, Nyquist)', () => {
    expect(() => designBandPass(1, 60, 100)).toThrow(/Nyquist/);
    expect(() => designBandPass(2, 1, 100)).toThrow(/band/);
  });
});
