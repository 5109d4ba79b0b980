/**
 * The one door through which the server runs the engine for tuning variants. Every computation of a variant (its
 * result, its size, its plot curves) goes through `computeVariant`, which is async so that it can be moved onto a
 * pool of worker threads without changing any caller.
 */
import {
  computeVariantCurves,
  computeVariantResult,
  computeVariantSize,
  type VariantComputeInput,
} from '../../../shared/compute/variant';
import type { VariantComputation, VariantCurves, VariantSize } from '../../../shared/contracts/variants';

export type VariantComputeJob =
  | { kind: 'result'; input: VariantComputeInput }
  | { kind: 'size'; input: VariantComputeInput }
  | { kind: 'curves'; input: VariantComputeInput; loadCaseIndex: number };

export interface VariantComputeAnswers {
  result: VariantComputation;
  size: Omit<VariantSize, 'applied' | 'variant'>;
  curves: VariantCurves;
}

/** Runs one variant computation; throws ComputeInputError (shared/compute/types.ts) when the engine refuses the inputs. */
export async function computeVariant<K extends VariantComputeJob['kind']>(job: Extract<VariantComputeJob, { kind: K }>): Promise<VariantComputeAnswers[K]> {
  await Promise.resolve();
  const j = job as VariantComputeJob;
  switch (j.kind) {
    case 'result':
      return computeVariantResult(j.input) as VariantComputeAnswers[K];
    case 'size':
      return computeVariantSize(j.input) as VariantComputeAnswers[K];
    case 'curves':
      return computeVariantCurves(j.input, j.loadCaseIndex) as VariantComputeAnswers[K];
  }
}
