/** Benchmarks of the design engine (loads, criteria, assess, size, robustness). */
export function runDesignBenchmarks(): void {}
