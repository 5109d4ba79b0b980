/**
 * The one door through which the server runs the engine for tuning variants. Every computation of a variant (its
 * result, its size, its plot curves) runs on the server's pool of engine worker threads (server/workers), off the
 * event loop and under the pool's time limit and answer bound, like the compute commands of the API.
 */
import { ComputeInputError } from '../../../shared/compute/types';
import type { VariantComputeInput } from '../../../shared/compute/variant';
import type { VariantComputation, VariantCurves, VariantSize } from '../../../shared/contracts/variants';
import { HttpError } from '../../lib/http-error';
import type { EnginePool } from '../../workers/engine-pool';

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
export async function computeVariant<K extends VariantComputeJob['kind']>(
  engine: EnginePool,
  job: Extract<VariantComputeJob, { kind: K }>,
): Promise<VariantComputeAnswers[K]> {
  const j = job as VariantComputeJob;
  try {
    switch (j.kind) {
      case 'result':
        return await engine.runJob<VariantComputeAnswers[K]>({ kind: 'variant-result', input: j.input });
      case 'size':
        return await engine.runJob<VariantComputeAnswers[K]>({ kind: 'variant-size', input: j.input });
      case 'curves':
        return await engine.runJob<VariantComputeAnswers[K]>({ kind: 'variant-curves', input: j.input, loadCaseIndex: j.loadCaseIndex });
    }
  } catch (error) {
    // The engine's refusal of the inputs comes back from the worker as a 400; the service maps its paths to the
    // variant's own fields.
    if (error instanceof HttpError && error.status === 400) throw new ComputeInputError(error.message, error.details);
    throw error;
  }
}
