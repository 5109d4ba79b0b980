import { describe, expect, it } from 'vitest';
import { decisionSummary } from './decision-summary';

// Invented result figures: the summary only words the snapshot's verdicts and margins (margin = 1 − utilisation).
const loadCase = (name: string, utilisation: number) => ({ loadCaseId: name, name, utilisation, verdict: utilisation <= 1 ? 'pass' : 'fail' }) as never;
const detuning = (worstUtilisation: number) =>
  ({ structureFrequencyToleranceRatio: 0.1, worstUtilisation, verdict: worstUtilisation <= 1 ? 'pass' : 'fail', loadCaseId: 'Crowd' }) as never;

describe('the decision in plain words', () => {
  it('says the design meets the limits, with the least margin and the detuning margin', () => {
    const summary = decisionSummary({ loadCases: [loadCase('Crowd', 0.344), loadCase('Walker', 0.075)], detuning: detuning(0.723), warnings: [] }, (id) => id);
    expect(summary.tone).toBe('meets');
    expect(summary.sentences).toEqual([
      'With this damper the peak acceleration stays within the limit on all 2 load cases checked; the least margin is 65.6 % (Crowd).',
      "It still does with the structure's frequency ±10 % off the model (least margin 27.7 %).",
      'The engine raised no warning.',
    ]);
  });

  it('names the load cases that exceed the limit, and a detuning that does', () => {
    const summary = decisionSummary({ loadCases: [loadCase('Crowd', 1.2), loadCase('Walker', 0.5)], detuning: detuning(1.4), warnings: [{}] as never }, (id) => `${id} case`);
    expect(summary.tone).toBe('exceeds');
    expect(summary.sentences[0]).toBe('With this damper the peak acceleration exceeds the limit on 1 of 2 load cases checked: Crowd.');
    expect(summary.sentences[1]).toContain('exceeds the limit (Crowd case, margin −40 %)');
    expect(summary.sentences[2]).toBe('The engine raised one warning: see the warnings below.');
  });
});
