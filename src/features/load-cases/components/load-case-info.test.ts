import { describe, expect, it } from 'vitest';
import { describeLoadCase, summariseLoadCase } from './load-case-info';

describe('what a load case follows', () => {
  it('names the Sétra crowd model and its vertical range', () => {
    // Sétra 2006: first-harmonic ψ = 0 below 1.0 Hz and above 2.6 Hz, vertical (PRODUCT spec: confirmed).
    const info = describeLoadCase({ kind: 'crowd', guide: 'setra', trafficClass: 'II', deckAreaM2: 150, harmonic: 1 });
    expect(info.problem).toBeNull();
    expect(info.source).toMatch(/Sétra\/AFGC footbridge guide \(2006\)/);
    expect(info.rangeHz).toEqual([1.0, 2.6]);
  });

  it('names the HiVoSS lateral range', () => {
    // HiVoSS 2008 lateral ψ: 0 at 0.5 Hz and at 1.2 Hz (PRODUCT spec: confirmed).
    const info = describeLoadCase({ kind: 'lateral', guide: 'hivoss', trafficClass: 'TC3', deckAreaM2: 150, harmonic: 1 });
    expect(info.rangeHz).toEqual([0.5, 1.2]);
    expect(info.direction).toBe('lateral');
  });

  it('says which values of a jogger are from memory', () => {
    // PRODUCT spec: jogging factors 1.6 / 0.7 / 0.2, the 800 N walker and the pacing bands are not confirmed.
    const info = describeLoadCase({ kind: 'jogger' });
    expect(info.source).toMatch(/Bachmann & Ammann \(1987\)/);
    expect(info.cautions.join(' ')).toMatch(/from memory/);
  });

  it('summarises the choices with their units', () => {
    expect(summariseLoadCase({ kind: 'crowd', guide: 'setra', trafficClass: 'II', deckAreaM2: 150, harmonic: 1 })).toContain('deck 150 m²');
    expect(summariseLoadCase({ kind: 'harmonic', modalForceAmplitudeN: 300, pacingRangeHz: [1.6, 2.4] })).toBe('modal force 300 N over 1.6–2.4 Hz');
  });
});
