/** `npm run bench`: prints timings of the engine and the design computations. Figures, not tests. */
import { runEngineBenchmarks } from './engine';
import { runDesignBenchmarks } from './design';

runEngineBenchmarks();
await Promise.resolve(runDesignBenchmarks());
