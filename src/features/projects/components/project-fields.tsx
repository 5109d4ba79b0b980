import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { createProjectSchema, projectKinds, type CreateProjectInput, type UpdateProjectInput } from '../../../../shared/contracts';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field';
import { formatProjectKind } from '../../../lib/format';

export type ProjectFormValues = CreateProjectInput;
/** The form's fields are the contract's, so a server issue always finds its field. */
export const projectFormFields = createProjectSchema.keyof().options;

export const emptyProjectForm: ProjectFormValues = { name: '', kind: 'footbridge', location: '', description: '' };

/** A new project: optional text left blank is sent as absent, not as an empty string. */
export function cleanProjectValues(values: ProjectFormValues): ProjectFormValues {
  return {
    name: values.name,
    kind: values.kind,
    location: values.location || undefined,
    description: values.description || undefined,
  };
}

/** A change of the project read at `version`: optional text left blank is sent as null, which clears it. */
export function projectChanges(values: ProjectFormValues, version: number): UpdateProjectInput {
  return {
    version,
    name: values.name,
    kind: values.kind,
    location: values.location || null,
    description: values.description || null,
  };
}

interface ProjectFieldsProps {
  register: UseFormRegister<ProjectFormValues>;
  errors: FieldErrors<ProjectFormValues>;
  idPrefix: string;
}

/** The fields a project is described by, shared by the create and the edit form. */
export function ProjectFields({ register, errors, idPrefix }: ProjectFieldsProps) {
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <TextField id={`${idPrefix}-name`} label="Project name" autoComplete="off" error={errors.name?.message} {...register('name')} />
      <SelectField
        id={`${idPrefix}-kind`}
        label="Structure kind"
        hint="A footbridge is checked for walking, running and crowd loads; a floor for walking on it."
        error={errors.kind?.message}
        {...register('kind')}
      >
        {projectKinds.map((kind) => (
          <option key={kind} value={kind}>
            {formatProjectKind(kind)}
          </option>
        ))}
      </SelectField>
      <TextField
        id={`${idPrefix}-location`}
        label="Location"
        optional
        autoComplete="off"
        error={errors.location?.message}
        {...register('location')}
      />
      <div className="sm:col-span-2">
        <TextAreaField
          id={`${idPrefix}-description`}
          label="Description"
          optional
          hint="What the structure is and why its liveliness matters, in a few lines."
          error={errors.description?.message}
          {...register('description')}
        />
      </div>
    </div>
  );
}
