import { describe, expect, it } from 'vitest';
import { getComputeCommand } from './commands';

describe('engine commands', () => {
  it('response takes the same structure object as assess (direction given) and answers the same as without it', () => {
    const response = getComputeCommand('response')!;
    const base = {
      tmds: [{ massKg: 600, frequencyHz: 2.05, dampingRatio: 0.07 }],
      forceAmplitudeN: 500,
      frequenciesHz: [1.8, 2.1, 2.4],
    };
    const structure = { modalMassKg: 30_000, frequencyHz: 2.1, dampingRatio: 0.006 };
    const plain = response.run(response.request.parse({ ...base, structure }));
    const withDirection = response.run(response.request.parse({ ...base, structure: { ...structure, direction: 'vertical' } }));
    expect(withDirection).toEqual(plain);
  });

  it('refuses an unknown direction of the structure, naming it', () => {
    const response = getComputeCommand('response')!;
    const result = response.request.safeParse({
      structure: { modalMassKg: 30_000, frequencyHz: 2.1, dampingRatio: 0.006, direction: 'diagonal' },
      tmds: [],
      forceAmplitudeN: 500,
      frequenciesHz: [1.8],
    });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0].path).toEqual(['structure', 'direction']);
  });
});
