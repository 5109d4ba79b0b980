/// <reference lib="webworker" />
/**
 * Recomputes a tuning variant in the browser while the engineer types or drags: the same pure code the server runs
 * to store a variant's result and to serve its curves (shared/compute/variant.ts), so the numbers on screen are the
 * ones that will be stored. Times each part with performance.now() and answers with the figures.
 */
import { computeVariantCurves, computeVariantResult, type VariantComputeInput } from '../../../../shared/compute/variant';
import { ComputeInputError } from '../../../../shared/compute/types';
import type { BenchmarkAnswer, LiveRequest, LiveAnswer } from './live-protocol';
import { runLiveBenchmark } from './benchmark';

declare const self: DedicatedWorkerGlobalScope;

self.onmessage = (event: MessageEvent<LiveRequest>) => {
  const { id, input, loadCaseIndex, benchmark } = event.data;
  if (benchmark) {
    let answer: BenchmarkAnswer;
    try {
      answer = { id, benchmark: true, figures: runLiveBenchmark(input as VariantComputeInput, loadCaseIndex) };
    } catch (error) {
      answer = { id, benchmark: true, error: error instanceof Error ? error.message : String(error) };
    }
    self.postMessage(answer);
    return;
  }
  const started = performance.now();
  try {
    const result = computeVariantResult(input as VariantComputeInput);
    const afterResult = performance.now();
    const curves = computeVariantCurves(input as VariantComputeInput, loadCaseIndex);
    const done = performance.now();
    const answer: LiveAnswer = {
      id,
      ok: true,
      result,
      curves,
      timing: { resultMs: afterResult - started, curvesMs: done - afterResult, totalMs: done - started },
    };
    self.postMessage(answer);
  } catch (error) {
    const issues = error instanceof ComputeInputError ? error.issues : [];
    const message = error instanceof Error ? error.message : String(error);
    const answer: LiveAnswer = { id, ok: false, error: { message, issues }, timing: { totalMs: performance.now() - started } };
    self.postMessage(answer);
  }
};
