import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { canEditProjects, type Project } from '../../../shared/contracts';
import { Button } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { projectsQueryOptions } from '../../features/projects/api/projects';
import { CreateProjectForm } from '../../features/projects/components/create-project-form';
import { ProjectList } from '../../features/projects/components/project-list';
import { useCurrentUser } from '../session';
import { PageTitle } from '../../components/ui/page-title';

export function ProjectsRoute() {
  const me = useCurrentUser();
  const projects = useQuery(projectsQueryOptions());
  const [creating, setCreating] = useState(false);
  const [created, setCreated] = useState<Project | null>(null);
  const canCreate = canEditProjects(me.role);

  return (
    <div className="flex flex-col gap-8">
      <PageTitle title="Projects" />
      <PageHeader
        eyebrow={me.organisation.name}
        title="Projects"
        lead="Every footbridge and floor your organisation is working on."
        actions={
          canCreate && !creating ? (
            <Button
              aria-expanded={creating}
              aria-controls="new-project-panel"
              onClick={() => {
                setCreated(null);
                setCreating(true);
              }}
            >
              New project
            </Button>
          ) : undefined
        }
      />

      {creating ? (
        <div id="new-project-panel">
          <Panel title="New project" description="Name the structure and say what kind it is; the rest can follow.">
            <CreateProjectForm
              onCreated={(project) => {
                setCreated(project);
                setCreating(false);
              }}
              onCancel={() => setCreating(false)}
            />
          </Panel>
        </div>
      ) : null}

      {created ? (
        <Notice tone="success" title="Project created">
          <Link to={`/projects/${created.id}`} className="font-semibold underline underline-offset-4">
            {created.name}
          </Link>{' '}
          is ready. Open it to see its overview and members.
        </Notice>
      ) : null}

      {projects.isPending ? (
        <Loading label="Loading projects…" />
      ) : projects.isError ? (
        <QueryError error={projects.error} retry={() => void projects.refetch()} what="the projects" />
      ) : projects.data.length === 0 ? (
        <div className="rounded-plate border border-dashed border-paper-line bg-paper-raised px-6 py-10 text-center">
          <p className="text-lead font-medium text-ink">No projects yet</p>
          <p className="mt-1 text-small text-ink-muted">
            {canCreate ? 'Create the first one with “New project”.' : 'An engineer or administrator of your organisation creates projects.'}
          </p>
        </div>
      ) : (
        <ProjectList projects={projects.data} highlightId={created?.id} />
      )}
    </div>
  );
}
