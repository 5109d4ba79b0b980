import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { toApiIssues } from './errors';

describe('toApiIssues', () => {
  it('names the dotted path of each issue in its message', () => {
    const schema = z.object({ structure: z.object({ frequencyHz: z.number().gt(0, 'must be greater than 0') }) });
    const result = schema.safeParse({ structure: { frequencyHz: -1 } });
    expect(result.success).toBe(false);
    expect(toApiIssues(result.error!)).toEqual([{ path: 'structure.frequencyHz', message: 'structure.frequencyHz: must be greater than 0' }]);
  });

  it('gives every unknown field of a strict object its own issue at its own path', () => {
    const schema = z.strictObject({ loadCase: z.strictObject({ deckAreaM2: z.number() }) });
    const result = schema.safeParse({ loadCase: { deckAreaM2: 1, deckArea: 2, area: 3 } });
    expect(result.success).toBe(false);
    expect(toApiIssues(result.error!).map((issue) => issue.path)).toEqual(['loadCase.deckArea', 'loadCase.area']);
  });
});
