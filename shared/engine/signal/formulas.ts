/**
 * Textbook relations between decay, bandwidth and the damping ratio of one viscously damped mode
 * (Chopra, Dynamics of Structures, ch. 2 free vibration and ch. 3 harmonic response; quoted from memory).
 */

/** Logarithmic decrement over `cycleCount` cycles: δ = ln(x_i / x_{i+N}) / N. */
export function logarithmicDecrementFromPeaks(firstPeak: number, laterPeak: number, cycleCount = 1): number {
  if (!(firstPeak > 0 && laterPeak > 0 && cycleCount > 0)) {
    throw new RangeError(`peaks and cycleCount: must be greater than 0 (got ${firstPeak}, ${laterPeak}, ${cycleCount})`);
  }
  return Math.log(firstPeak / laterPeak) / cycleCount;
}

/** ζ = δ / √(4π² + δ²), exact for a viscously damped single mode (δ = 2πζ/√(1 − ζ²)). */
export function dampingRatioFromLogarithmicDecrement(logarithmicDecrement: number): number {
  return logarithmicDecrement / Math.sqrt(4 * Math.PI * Math.PI + logarithmicDecrement * logarithmicDecrement);
}

/** δ = 2πζ / √(1 − ζ²). */
export function logarithmicDecrementFromDampingRatio(dampingRatio: number): number {
  return (2 * Math.PI * dampingRatio) / Math.sqrt(1 - dampingRatio * dampingRatio);
}

/** Half-power bandwidth: ζ ≈ (f_b − f_a) / (2 f_n), accurate to O(ζ²) for light damping. */
export function dampingRatioFromHalfPower(lowerHz: number, upperHz: number, peakHz: number): number {
  return (upperHz - lowerHz) / (2 * peakHz);
}
