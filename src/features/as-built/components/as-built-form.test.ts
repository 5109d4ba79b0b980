/**
 * The form's body: row i is unit i + 1, blanks are left out, so that the contract's error paths
 * (`units.1.movingMassKg`) point at the form's own rows; checked with the contract schema the server uses.
 */
import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { asBuiltInputSchemaFor } from '../../../../shared/contracts/as-built';
import { asBuiltBody } from './as-built-form';

describe('as-built form body', () => {
  it('numbers the rows from 1 and leaves out what was left blank', () => {
    const body = asBuiltBody({
      units: [
        { movingMassKg: 250, springRateNPerM: undefined, frequencyHz: 2.01, measuredAt: '', note: '  ' },
        { movingMassKg: 251.5, springRateNPerM: 39_000, frequencyHz: undefined, measuredAt: '2026-11-30', note: ' shimmed ' },
      ],
      note: '',
    });
    expect(body).toEqual({
      units: [
        { unitNumber: 1, movingMassKg: 250, frequencyHz: 2.01 },
        { unitNumber: 2, movingMassKg: 251.5, springRateNPerM: 39_000, measuredAt: '2026-11-30', note: 'shimmed' },
      ],
    });
    expect(asBuiltInputSchemaFor(2).parse(body)).toEqual(body);
  });

  it("keeps a blank mass out, so the schema names that row's field as required", () => {
    const body = asBuiltBody({ units: [{ movingMassKg: 250, measuredAt: '', note: '' }, { measuredAt: '', note: '' }], note: 'x' });
    const result = asBuiltInputSchemaFor(2).safeParse(body);
    expect(result.success).toBe(false);
    const issue = (result.error as ZodError).issues[0];
    expect(issue.path).toEqual(['units', 1, 'movingMassKg']);
    expect(issue.message).toBe('is required');
  });
});
