import { describe, expect, it } from 'vitest';
import type { ResolverOptions } from 'react-hook-form';
import { chainPath, emptyModelForm, modelBody, modelFormResolver, resizeModelForm, type ModelFormValues } from './lumped-model-form';

const options = { fields: {}, shouldUseNativeValidation: false } as unknown as ResolverOptions<ModelFormValues>;

describe('the model form', () => {
  it('sends a chain as its matrices, with blank labels named by number', () => {
    const values: ModelFormValues = { ...emptyModelForm(2), name: 'Two masses', massesKg: [1000, 200], springsNPerM: [4e5, 8e4], dofLabels: ['deck', ''] };
    expect(modelBody(values)).toEqual({
      name: 'Two masses',
      massMatrixKg: [
        [1000, 0],
        [0, 200],
      ],
      stiffnessMatrixNPerM: [
        [4.8e5, -8e4],
        [-8e4, 8e4],
      ],
      dofLabels: ['deck', 'DOF 2'],
    });
    expect(modelBody({ ...values, dofLabels: ['', ' '] }).dofLabels).toBeUndefined();
  });

  it('keeps entries and empties new ones when the number of DOFs changes', () => {
    const values: ModelFormValues = { ...emptyModelForm(2), entry: 'matrices', massMatrixKg: [[1, 0], [0, 2]], stiffnessMatrixNPerM: [[3, -1], [-1, 1]] };
    const grown = resizeModelForm(values, 3);
    expect(grown.massMatrixKg).toEqual([
      [1, 0, 0],
      [0, 2, 0],
      [0, 0, undefined],
    ]);
    expect(resizeModelForm(grown, 1).stiffnessMatrixNPerM).toEqual([[3]]);
  });

  it('puts the contract’s complaints about built matrices under the chain entry they come from', () => {
    expect(chainPath('massMatrixKg.1.1')).toBe('massesKg.1');
    expect(chainPath('stiffnessMatrixNPerM.0.1')).toBe('springsNPerM.1');
    expect(chainPath('stiffnessMatrixNPerM.2.2')).toBe('springsNPerM.2');
    expect(chainPath('name')).toBe('name');
  });

  it('checks the values with the contract schema: a missing mass and a missing name are named', async () => {
    const values: ModelFormValues = { ...emptyModelForm(2), massesKg: [1000, undefined], springsNPerM: [4e5, 8e4] };
    const result = await modelFormResolver(values, undefined, options);
    expect(Object.keys(result.errors).sort()).toEqual(['massesKg', 'name']);
    expect((result.errors.massesKg as unknown as Record<number, { message: string }>)[1].message).toMatch(/required|number/);
  });

  it('passes a complete model through as the request body', async () => {
    const values: ModelFormValues = { ...emptyModelForm(1), name: 'One mass', massesKg: [500], springsNPerM: [2e5] };
    const result = await modelFormResolver(values, undefined, options);
    expect(result.errors).toEqual({});
    expect(result.values).toEqual({ name: 'One mass', massMatrixKg: [[500]], stiffnessMatrixNPerM: [[2e5]] });
  });
});
