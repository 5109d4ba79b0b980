import { describe, expect, it } from 'vitest';
import { createModeSchema, updateModeSchema, type SavedMode } from '../../../../shared/contracts';
import { modeChanges, modeToForm, type ModeFormValues } from './mode-changes';

// Invented modes of an invented footbridge; SI throughout (Hz, kg, N·m², kg/m).
const record = { version: 4, createdAt: '2026-01-01T00:00:00Z', updatedAt: '2026-01-01T00:00:00Z', createdBy: null, projectId: 'p', structureId: 's' };
const typed: SavedMode = {
  ...record,
  id: 'typed',
  label: 'First lateral',
  direction: 'lateral',
  frequencyHz: 0.94,
  modalMassKg: 61_000,
  dampingRatio: 0.005,
  modeShapeMean: 0.637,
  source: { kind: 'typed' },
};
const beam: SavedMode = {
  ...record,
  id: 'beam',
  label: 'First vertical bending',
  direction: 'vertical',
  frequencyHz: 2.42,
  modalMassKg: 50_400,
  dampingRatio: 0.006,
  modeShapeMean: 0.637,
  source: { kind: 'beam', support: 'simply-supported', lengthM: 42, bendingStiffnessNM2: 3.2e9, massPerLengthKgPerM: 2400, modeNumber: 1 },
};
const modelId = '0b1c2d3e-4f50-4617-8293-a4b5c6d7e8f9';
const fromModel: SavedMode = {
  ...record,
  id: 'model',
  label: 'Coupled mode 1',
  direction: 'vertical',
  frequencyHz: 1.9,
  modalMassKg: 48_000,
  dampingRatio: 0.006,
  modeShapeMean: null,
  source: { kind: 'lumped-model', modelId, modeNumber: 1, dofIndex: 0 },
};

/** What the form hands over on submit: its values read by the create schema, as the resolver does. */
const submitted = (values: ModeFormValues) => createModeSchema.parse(values);

describe('modeToForm and modeChanges', () => {
  it('opens each kind of mode without change: the body names only the version', () => {
    for (const mode of [typed, beam, fromModel]) {
      expect(modeChanges(mode, submitted(modeToForm(mode)))).toEqual({ version: 4 });
    }
  });

  it('never puts the derived numbers of a beam or model mode in the form', () => {
    for (const mode of [beam, fromModel]) {
      const values = modeToForm(mode);
      expect(values.frequencyHz).toBeUndefined();
      expect(values.modalMassKg).toBeUndefined();
      expect(values.modeShapeMean).toBeUndefined();
      // The create schema refuses those fields beside a derived source, so the prefilled form passes it.
      expect(createModeSchema.safeParse(values).success).toBe(true);
    }
  });

  it('sends only the typed numbers that changed, and clears a mean |φ| left blank with null', () => {
    const values = { ...modeToForm(typed), dampingRatio: 0.008, modeShapeMean: undefined };
    const body = modeChanges(typed, submitted(values));
    expect(body).toEqual({ version: 4, dampingRatio: 0.008, modeShapeMean: null });
    expect(updateModeSchema.safeParse(body).success).toBe(true);
  });

  it('sends a changed beam as its whole source, in SI, without the numbers the server derives from it', () => {
    const values = modeToForm(beam);
    const body = modeChanges(beam, submitted({ ...values, source: { ...(values.source as object), lengthM: 45 } as ModeFormValues['source'] }));
    expect(body).toEqual({
      version: 4,
      source: { kind: 'beam', support: 'simply-supported', lengthM: 45, bendingStiffnessNM2: 3.2e9, massPerLengthKgPerM: 2400, modeNumber: 1 },
    });
    expect(updateModeSchema.safeParse(body).success).toBe(true);
  });

  it('sends the label, direction and damping of a model mode but never its frequency or modal mass', () => {
    const values = { ...modeToForm(fromModel), label: '  Coupled mode 1 at midspan ', direction: 'lateral' as const, dampingRatio: 0.007 };
    const body = modeChanges(fromModel, submitted(values));
    expect(body).toEqual({ version: 4, label: 'Coupled mode 1 at midspan', direction: 'lateral', dampingRatio: 0.007 });
    expect(updateModeSchema.safeParse(body).success).toBe(true);
  });

  it('reads a model id in capitals as the same model, and sends another degree of freedom as a new source', () => {
    const same = { ...modeToForm(fromModel), source: { kind: 'lumped-model' as const, modelId: modelId.toUpperCase(), modeNumber: 1, dofIndex: 0 } };
    expect(modeChanges(fromModel, submitted(same))).toEqual({ version: 4 });
    const moved = { ...modeToForm(fromModel), source: { kind: 'lumped-model' as const, modelId, modeNumber: 2, dofIndex: 1 } };
    expect(modeChanges(fromModel, submitted(moved))).toEqual({ version: 4, source: { kind: 'lumped-model', modelId, modeNumber: 2, dofIndex: 1 } });
  });
});
