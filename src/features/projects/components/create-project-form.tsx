import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { createProjectSchema, type Project } from '../../../../shared/contracts';
import { FormActions, FormErrorNotice } from '../../../components/ui/form-actions';
import { applyServerIssues } from '../../../lib/form-errors';
import { useCreateProject } from '../api/projects';
import { cleanProjectValues, emptyProjectForm, ProjectFields, projectFormFields, type ProjectFormValues } from './project-fields';

interface CreateProjectFormProps {
  onCreated: (project: Project) => void;
  onCancel: () => void;
}

export function CreateProjectForm({ onCreated, onCancel }: CreateProjectFormProps) {
  const createProject = useCreateProject();
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors },
  } = useForm<ProjectFormValues>({ resolver: zodResolver(createProjectSchema), defaultValues: emptyProjectForm });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    createProject.mutate(cleanProjectValues(values), {
      onSuccess: (project) => {
        reset(emptyProjectForm);
        onCreated(project);
      },
      onError: (error) => {
        setFormError(applyServerIssues(error, projectFormFields, setError));
      },
    });
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="New project" className="flex flex-col gap-5">
      <FormErrorNotice title="The project was not created" error={formError} />
      <ProjectFields register={register} errors={errors} idPrefix="new-project" />
      <FormActions submitLabel="Create project" busy={createProject.isPending} onCancel={onCancel} />
    </form>
  );
}
