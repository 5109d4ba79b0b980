import { describe, expect, it } from 'vitest';
import { analyticSignal, createRealFft, nextPowerOfTwo, previousPowerOfTwo } from './fft';
import { seededRandom } from '../test-fixtures';

describe('FFT wrappers (fft.js)', () => {
  it('rounds sizes to powers of two', () => {
    expect([1, 2, 3, 1024, 1025].map(nextPowerOfTwo)).toEqual([2, 2, 4, 1024, 2048]);
    expect([2, 3, 1023, 1024].map(previousPowerOfTwo)).toEqual([2, 2, 512, 1024]);
  });

  it('the real transform equals the defining sum X_k = Σ x_n e^{−2πikn/N} (direct evaluation as the independent check)', () => {
    const random = seededRandom(3);
    const n = 64;
    const x = Float64Array.from({ length: n }, () => random() - 0.5);
    const spectrum = createRealFft(n).transform(x);
    for (let k = 0; k <= n / 2; k++) {
      let re = 0;
      let im = 0;
      for (let j = 0; j < n; j++) {
        re += x[j] * Math.cos((2 * Math.PI * k * j) / n);
        im -= x[j] * Math.sin((2 * Math.PI * k * j) / n);
      }
      expect(spectrum[2 * k]).toBeCloseTo(re, 12);
      expect(spectrum[2 * k + 1]).toBeCloseTo(im, 12);
    }
  });

  it('the analytic signal of A cos(ωt + φ) has the envelope A and the phase ωt + φ away from the edges', () => {
    const n = 1000;
    const amplitude = 0.3;
    const omega = (2 * Math.PI * 37.25) / 1024; // not a whole number of cycles in the record, not a line of the padded FFT
    const x = Float64Array.from({ length: n }, (_, i) => amplitude * Math.cos(omega * i + 0.4));
    const envelope = new Float64Array(n);
    const phase = new Float64Array(n);
    analyticSignal(x, envelope, phase);
    for (let i = 200; i < 800; i += 7) {
      expect(envelope[i]).toBeCloseTo(amplitude, 2);
      const expected = Math.atan2(Math.sin(omega * i + 0.4), Math.cos(omega * i + 0.4));
      expect(Math.abs(Math.atan2(Math.sin(phase[i] - expected), Math.cos(phase[i] - expected)))).toBeLessThan(0.02);
    }
  });
});
