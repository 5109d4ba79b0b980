import { describe, expect, it } from 'vitest';
import { createLoadCaseSchema, updateLoadCaseSchema, type SavedLoadCase } from '../../../../shared/contracts';
import { loadCaseChanges, loadCaseToForm } from './load-case-changes';
import { loadCaseBody, type LoadCaseFormValues } from './load-case-form';

// Invented load cases; SI throughout (m², N, Hz).
const record = { version: 2, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z', createdBy: null, projectId: 'p' };
const crowdByDensity: SavedLoadCase = { ...record, id: 'crowd', name: 'Crowd 0.6 P/m²', spec: { kind: 'crowd', guide: 'setra', densityPerM2: 0.6, deckAreaM2: 147, harmonic: 1 } };
const walker: SavedLoadCase = { ...record, id: 'walker', name: 'One walker', spec: { kind: 'walker', bodyWeightN: 700, pacingRangeHz: [1.6, 2.4] } };

/** What the form hands over on submit: the body its values make, read by the create schema, as the resolver does. */
const submitted = (values: LoadCaseFormValues) => createLoadCaseSchema.parse(loadCaseBody(values));

describe('loadCaseToForm and loadCaseChanges', () => {
  it('opens a load case without change: the body names only the version', () => {
    for (const loadCase of [crowdByDensity, walker]) expect(loadCaseChanges(loadCase, submitted(loadCaseToForm(loadCase)))).toEqual({ version: 2 });
  });

  it('opens a crowd given by a density on "a density", with a class of its guide ready for a switch', () => {
    const values = loadCaseToForm(crowdByDensity);
    expect(values.densityBy).toBe('density');
    // Sétra 2006 traffic classes III, II, I (PRODUCT spec: confirmed); the first listed is the form's choice.
    expect(values.spec.trafficClass).toBe('III');
    expect(loadCaseBody(values).spec).toEqual({ kind: 'crowd', guide: 'setra', densityPerM2: 0.6, deckAreaM2: 147, harmonic: 1 });
  });

  it('sends only the name when only the name changed', () => {
    expect(loadCaseChanges(walker, submitted({ ...loadCaseToForm(walker), name: 'One walker, 700 N ' }))).toEqual({ version: 2, name: 'One walker, 700 N' });
  });

  it('sends the whole spec when any of it changed, with one of density and class only', () => {
    const values = loadCaseToForm(crowdByDensity);
    const byClass = loadCaseChanges(crowdByDensity, submitted({ ...values, densityBy: 'class', spec: { ...values.spec, trafficClass: 'II' } }));
    expect(byClass).toEqual({ version: 2, spec: { kind: 'crowd', guide: 'setra', trafficClass: 'II', deckAreaM2: 147, harmonic: 1 } });
    expect(updateLoadCaseSchema.safeParse(byClass).success).toBe(true);

    const band = loadCaseChanges(walker, submitted({ ...loadCaseToForm(walker), spec: { ...loadCaseToForm(walker).spec, pacingRangeHz: [1.5, 2.5] } }));
    expect(band).toEqual({ version: 2, spec: { kind: 'walker', bodyWeightN: 700, pacingRangeHz: [1.5, 2.5] } });
  });

  it('reads a default written out as no change (harmonic 1 is the engine schema default)', () => {
    const stored: SavedLoadCase = { ...crowdByDensity, spec: { kind: 'crowd', guide: 'setra', densityPerM2: 0.6, deckAreaM2: 147, harmonic: 1 } };
    const values = loadCaseToForm(stored);
    const { harmonic: _dropped, ...withoutHarmonic } = values.spec;
    expect(loadCaseChanges(stored, createLoadCaseSchema.parse(loadCaseBody({ ...values, spec: withoutHarmonic as LoadCaseFormValues['spec'] })))).toEqual({ version: 2 });
  });
});
