import type { ApiIssue, VariantComputation, VariantCurves } from '../../../../shared/contracts';
import type { VariantComputeInput } from '../../../../shared/compute/variant';

/** A request to the live worker: the variant's inputs and which of its load cases to plot. */
export interface LiveRequest {
  id: number;
  input: VariantComputeInput;
  loadCaseIndex: number;
  /** Run the reference workload (benchmark.ts) instead of the live check. */
  benchmark?: boolean;
}

export interface BenchmarkAnswer {
  id: number;
  benchmark: true;
  figures?: import('./benchmark').BenchmarkFigures;
  error?: string;
}

export type LiveAnswer =
  | {
      id: number;
      ok: true;
      result: VariantComputation;
      curves: VariantCurves;
      timing: { resultMs: number; curvesMs: number; totalMs: number };
    }
  | { id: number; ok: false; error: { message: string; issues: ApiIssue[] }; timing: { totalMs: number } };
