import type { VariantResult } from '../../../../shared/contracts/variants';

/**
 * What the variant page says about a result the server served without recomputing it: only an approved (frozen)
 * design's result is served so (`stale`), when the engine version that computed it is not the one running now.
 * Null when there is nothing to say.
 */
export function frozenResultNotice(result: Pick<VariantResult, 'stale' | 'engineVersion' | 'computedAt'> | null): { title: string; body: string } | null {
  if (!result?.stale) return null;
  return {
    title: 'Approved result from an earlier engine version',
    body:
      `These figures were computed by engine version ${result.engineVersion}, not by the engine running now. ` +
      'The owner approved them as they are, so the design is frozen and they are not computed again; the hardware sheet ' +
      'uses the same approved figures. To see this design under the running engine, copy the variant: the copy is computed afresh.',
  };
}
