/** `npm run bench`: prints timings of the engine, the design computations and whole calc processes. Figures, not tests. */
import { runEngineBenchmarks } from './engine';
import { runDesignBenchmarks } from './design';
import { runCalcBenchmarks } from './calc';

runEngineBenchmarks();
runDesignBenchmarks();
runCalcBenchmarks();
