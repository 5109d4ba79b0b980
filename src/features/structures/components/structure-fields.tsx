import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { structureKinds, type CreateStructureInput, type Structure, type UpdateStructureInput } from '../../../../shared/contracts';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { numberOrUndefined } from '../../../lib/form-values';
import { structureKindLabels } from './labels';

export type StructureFormValues = CreateStructureInput;
export const structureFormFields = ['name', 'kind', 'spanM', 'widthM', 'deckAreaM2', 'notes'] as const satisfies readonly (keyof StructureFormValues)[];

export const emptyStructureForm: StructureFormValues = { name: '', kind: 'footbridge-span', notes: '' };

export function structureToForm(structure: Structure): StructureFormValues {
  return {
    name: structure.name,
    kind: structure.kind,
    spanM: structure.spanM ?? undefined,
    widthM: structure.widthM ?? undefined,
    deckAreaM2: structure.deckAreaM2 ?? undefined,
    notes: structure.notes ?? '',
  };
}

/** A new structure: blank optional fields are left out. */
export function cleanStructureValues(values: StructureFormValues): CreateStructureInput {
  return { ...values, notes: values.notes || undefined };
}

/** A change of the structure read at `version`: blank optional fields are sent as null, which clears them. */
export function structureChanges(values: StructureFormValues, version: number): UpdateStructureInput {
  return {
    version,
    name: values.name,
    kind: values.kind,
    spanM: values.spanM ?? null,
    widthM: values.widthM ?? null,
    deckAreaM2: values.deckAreaM2 ?? null,
    notes: values.notes || null,
  };
}

interface StructureFieldsProps {
  register: UseFormRegister<StructureFormValues>;
  errors: FieldErrors<StructureFormValues>;
  idPrefix: string;
}

export function StructureFields({ register, errors, idPrefix }: StructureFieldsProps) {
  const number = { setValueAs: numberOrUndefined };
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <TextField id={`${idPrefix}-name`} label="Structure name" autoComplete="off" error={errors.name?.message} {...register('name')} />
      <SelectField id={`${idPrefix}-kind`} label="Kind" error={errors.kind?.message} {...register('kind')}>
        {structureKinds.map((kind) => (
          <option key={kind} value={kind}>
            {structureKindLabels[kind]}
          </option>
        ))}
      </SelectField>
      <TextField id={`${idPrefix}-span`} label="Span [m]" optional inputMode="decimal" error={errors.spanM?.message} {...register('spanM', number)} />
      <TextField id={`${idPrefix}-width`} label="Width [m]" optional inputMode="decimal" error={errors.widthM?.message} {...register('widthM', number)} />
      <TextField
        id={`${idPrefix}-deck-area`}
        label="Deck area [m²]"
        optional
        inputMode="decimal"
        hint="The walkable area a crowd stands on; crowd load cases multiply it by the density."
        error={errors.deckAreaM2?.message}
        {...register('deckAreaM2', number)}
      />
      <div className="sm:col-span-2">
        <TextAreaField id={`${idPrefix}-notes`} label="Notes" optional error={errors.notes?.message} {...register('notes')} />
      </div>
    </div>
  );
}
