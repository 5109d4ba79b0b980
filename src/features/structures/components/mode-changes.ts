import { modeSourceSchema, type CreateModeInput, type ModeSourceInput, type SavedMode, type UpdateModeInput } from '../../../../shared/contracts';
import { sameValue } from '../../../components/forms/changes';

/** The values of the add-a-mode forms (the create contract's input), SI as everywhere. */
export type ModeFormValues = CreateModeInput;

/** A stored mode as the values of the form of its source: a derived mode's derived numbers are not among them. */
export function modeToForm(mode: SavedMode): ModeFormValues {
  const common = { label: mode.label, direction: mode.direction, dampingRatio: mode.dampingRatio };
  if (mode.source.kind === 'typed') {
    return {
      ...common,
      frequencyHz: mode.frequencyHz,
      modalMassKg: mode.modalMassKg,
      modeShapeMean: mode.modeShapeMean ?? undefined,
      source: { kind: 'typed' },
    };
  }
  return { ...common, source: { ...mode.source } };
}

/** The source as the server keeps it (defaults filled in, the model id in lower case), for comparing. */
function normalSource(source: ModeSourceInput | undefined) {
  const parsed = modeSourceSchema.safeParse(source ?? { kind: 'typed' });
  return parsed.success ? parsed.data : source;
}

/**
 * The PATCH body of a change to `mode` (the mode as the form was opened on it): its version and only the fields whose
 * value differs. A derived mode's numbers are never sent: a changed beam or model choice is sent as the whole new
 * source, and the server derives them again. A mean |φ| left blank on a typed mode that had one clears it (null).
 */
export function modeChanges(mode: SavedMode, values: ModeFormValues): UpdateModeInput {
  const body: UpdateModeInput = { version: mode.version };
  const label = values.label.trim();
  if (label !== mode.label) body.label = label;
  const direction = values.direction ?? 'vertical';
  if (direction !== mode.direction) body.direction = direction;
  if (values.dampingRatio !== mode.dampingRatio) body.dampingRatio = values.dampingRatio;

  const source = normalSource(values.source);
  const sourceChanged = !sameValue(source, mode.source);
  if (sourceChanged) body.source = source as ModeSourceInput;
  if ((source?.kind ?? 'typed') === 'typed') {
    // Typed numbers: those that differ, or all of them when the mode was derived until now.
    const wasTyped = mode.source.kind === 'typed';
    if (values.frequencyHz !== undefined && (!wasTyped || values.frequencyHz !== mode.frequencyHz)) body.frequencyHz = values.frequencyHz;
    if (values.modalMassKg !== undefined && (!wasTyped || values.modalMassKg !== mode.modalMassKg)) body.modalMassKg = values.modalMassKg;
    const shapeMean = values.modeShapeMean ?? null;
    if (shapeMean !== mode.modeShapeMean) body.modeShapeMean = shapeMean;
  }
  return body;
}
