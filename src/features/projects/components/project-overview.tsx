import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { createProjectSchema, type Project } from '../../../../shared/contracts';
import { Button } from '../../../components/ui/button';
import { Detail } from '../../../components/ui/detail';
import { FormActions, FormErrorNotice } from '../../../components/ui/form-actions';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { describeError, isApiError } from '../../../lib/api-client';
import { applyServerIssues } from '../../../lib/form-errors';
import { formatDateTime, formatProjectKind } from '../../../lib/format';
import { useEditToggle } from '../../../lib/use-edit-toggle';
import { useDeleteProject, useUpdateProject } from '../api/projects';
import { projectChanges, ProjectFields, projectFormFields, type ProjectFormValues } from './project-fields';

interface ProjectOverviewProps {
  project: Project;
  canEdit: boolean;
  /** Fetches the project again (after someone else changed it); undefined when that failed. */
  onReload: () => Promise<Project | undefined>;
  onDeleted: () => void;
}

export function ProjectOverview({ project, canEdit, onReload, onDeleted }: ProjectOverviewProps) {
  const { editing, saved, start: startEditing, finish: finishEditing } = useEditToggle();

  return (
    <div className="flex flex-col gap-6">
      {saved && !editing ? <Notice tone="success" title="Project details saved" /> : null}
      <Panel
        title="Project details"
        actions={
          canEdit && !editing ? (
            <Button tone="secondary" onClick={startEditing}>
              Edit details
            </Button>
          ) : undefined
        }
      >
        {editing ? (
          <EditProjectForm
            project={project}
            onReload={onReload}
            onDone={finishEditing}
          />
        ) : (
          <dl className="grid gap-x-8 gap-y-4 sm:grid-cols-2">
            <Detail term="Project name">{project.name}</Detail>
            <Detail term="Structure kind">{formatProjectKind(project.kind)}</Detail>
            <Detail term="Location">{project.location ?? <span className="text-ink-muted">Not given</span>}</Detail>
            <Detail term="Last changed">
              {formatDateTime(project.updatedAt)} <span className="text-ink-muted">(revision {project.version})</span>
            </Detail>
            <div className="sm:col-span-2">
              <Detail term="Description">
                {project.description ? (
                  <span className="whitespace-pre-line">{project.description}</span>
                ) : (
                  <span className="text-ink-muted">No description yet.</span>
                )}
              </Detail>
            </div>
          </dl>
        )}
      </Panel>
      {canEdit ? <DeleteProject project={project} onDeleted={onDeleted} /> : null}
    </div>
  );
}

function toFormValues(project: Project): ProjectFormValues {
  return { name: project.name, kind: project.kind, location: project.location ?? '', description: project.description ?? '' };
}

function EditProjectForm({ project, onReload, onDone }: { project: Project; onReload: () => Promise<Project | undefined>; onDone: (saved: boolean) => void }) {
  const updateProject = useUpdateProject(project.id);
  const [formError, setFormError] = useState<string | null>(null);
  const [stale, setStale] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isDirty },
  } = useForm<ProjectFormValues>({ resolver: zodResolver(createProjectSchema), defaultValues: toFormValues(project) });

  const onSubmit = handleSubmit((values) => {
    setFormError(null);
    setStale(false);
    updateProject.mutate(projectChanges(values, project.version), {
      onSuccess: () => onDone(true),
      onError: (error) => {
        if (isApiError(error) && error.isConflict) setStale(true);
        else setFormError(applyServerIssues(error, projectFormFields, setError));
      },
    });
  });

  const reload = async () => {
    const latest = await onReload();
    if (latest) reset(toFormValues(latest));
    setStale(false);
  };

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Edit project details" className="flex flex-col gap-5">
      {stale ? (
        <Notice
          tone="caution"
          title="Changed by someone else — reload"
          action={
            <Button tone="secondary" onClick={() => void reload()}>
              Reload project
            </Button>
          }
        >
          Someone changed this project after you opened it, so your changes were not saved. Reload to see the latest
          details (your edits in this form will be replaced), then make your change again.
        </Notice>
      ) : null}
      <FormErrorNotice title="The changes were not saved" error={formError} />
      <ProjectFields register={register} errors={errors} idPrefix="edit-project" />
      <FormActions submitLabel="Save changes" busy={updateProject.isPending} disabled={!isDirty} onCancel={() => onDone(false)} />
    </form>
  );
}

function DeleteProject({ project, onDeleted }: { project: Project; onDeleted: () => void }) {
  const deleteProject = useDeleteProject(project.id);
  const [confirming, setConfirming] = useState(false);
  return (
    <Panel title="Delete project" description="Deleting removes the project and everything recorded in it for every member.">
      {deleteProject.isError ? (
        <div className="mb-4">
          <Notice tone="error" title="The project was not deleted">
            {describeError(deleteProject.error)}
          </Notice>
        </div>
      ) : null}
      {confirming ? (
        <div className="flex flex-col gap-3 sm:flex-row sm:items-center">
          <p className="text-small font-medium text-signal-error">Delete “{project.name}” for good?</p>
          <div className="flex gap-3">
            <Button tone="danger" busy={deleteProject.isPending} onClick={() => deleteProject.mutate(undefined, { onSuccess: onDeleted })}>
              Yes, delete this project
            </Button>
            <Button tone="quiet" onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </div>
        </div>
      ) : (
        <Button tone="danger-outline" onClick={() => setConfirming(true)}>
          Delete project…
        </Button>
      )}
    </Panel>
  );
}
