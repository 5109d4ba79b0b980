import { describe, expect, it } from 'vitest';
import { formatNumber, formatPercent, formatQuantity, formatSignedNumber } from './format';

describe('formatNumber', () => {
  it('rounds to significant digits and groups thousands', () => {
    expect(formatNumber(1.02834)).toBe('1.028');
    expect(formatNumber(50_400.2)).toBe('50,400');
    expect(formatNumber(0.5)).toBe('0.5');
    expect(formatNumber(-0.1682, 3)).toBe('−0.168');
  });

  it('writes very large and very small numbers as powers of ten', () => {
    expect(formatNumber(3.2e9)).toBe('3.2 × 10⁹');
    expect(formatNumber(2.5e-6, 3)).toBe('2.5 × 10⁻⁶');
    expect(formatNumber(7.2e6)).toBe('7,200,000');
  });

  it('says what an infinite or missing number is instead of printing NaN', () => {
    expect(formatNumber(Number.POSITIVE_INFINITY)).toBe('∞');
    expect(formatNumber(Number.NaN)).toBe('—');
  });

  it('shows the sign of a change both ways', () => {
    expect(formatSignedNumber(10.44, 3)).toBe('+10.4');
    expect(formatSignedNumber(-3.21, 2)).toBe('−3.2');
    expect(formatSignedNumber(0)).toBe('0');
  });

  it('puts the unit after the number and ratios in percent', () => {
    expect(formatQuantity(1.8735, 'Hz')).toBe('1.874 Hz');
    expect(formatPercent(0.006)).toBe('0.6 %');
  });
});
