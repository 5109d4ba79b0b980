import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { createProjectSchema, type Project } from '../../../../shared/contracts';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
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
      {formError ? (
        <Notice tone="error" title="The project was not created">
          {formError}
        </Notice>
      ) : null}
      <ProjectFields register={register} errors={errors} idPrefix="new-project" />
      <div className="flex flex-wrap gap-3">
        <Button type="submit" busy={createProject.isPending}>
          Create project
        </Button>
        <Button tone="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
