import { useQuery } from '@tanstack/react-query';
import { Link, NavLink, Outlet, useOutletContext, useParams } from 'react-router-dom';
import { canEditProjects, type Project } from '../../../shared/contracts';
import { buttonClass } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { PageTitle } from '../../components/ui/page-title';
import { QueryError } from '../../components/ui/query-error';
import { projectQueryOptions } from '../../features/projects/api/projects';
import { ProjectKindBadge } from '../../features/projects/components/project-kind-badge';
import { projectSections } from '../../features/projects/components/project-sections';
import { isApiError } from '../../lib/api-client';
import { useCurrentUser } from '../session';

export interface ProjectOutletContext {
  project: Project;
  canEdit: boolean;
  /** Fetches the project again; resolves to the stored project (undefined when the fetch failed). */
  reload: () => Promise<Project | undefined>;
}

export function useProjectContext(): ProjectOutletContext {
  return useOutletContext<ProjectOutletContext>();
}

const sectionLinkClass = (available: boolean) =>
  ({ isActive }: { isActive: boolean }) =>
    `flex items-center justify-between gap-2 rounded-plate px-3 py-2 text-small ${
      isActive
        ? 'bg-tide-700 font-semibold text-white'
        : available
          ? 'font-semibold text-ink hover:bg-paper-sunk'
          : 'text-ink-muted hover:bg-paper-sunk hover:text-ink-soft'
    }`;

export function ProjectLayoutRoute() {
  const { projectId = '' } = useParams();
  const me = useCurrentUser();
  const project = useQuery(projectQueryOptions(projectId));

  if (project.isPending) return <Loading label="Loading the project…" />;
  if (project.isError) {
    if (isApiError(project.error) && (project.error.isNotFound || project.error.status === 400)) {
      return (
        <div className="flex flex-col items-start gap-4">
          <h1 className="text-headline font-semibold text-ink">Project not found</h1>
          <p className="text-body text-ink-soft">
            There is no project at this address in your organisation. It may have been deleted, or the link may be wrong.
          </p>
          <Link to="/projects" className={buttonClass('secondary')}>
            Back to projects
          </Link>
        </div>
      );
    }
    return <QueryError error={project.error} retry={() => void project.refetch()} what="the project" />;
  }

  const context: ProjectOutletContext = {
    project: project.data,
    canEdit: canEditProjects(me.role),
    reload: async () => (await project.refetch()).data,
  };

  return (
    <div className="flex flex-col gap-8">
      <PageTitle title={project.data.name} />
      <header className="flex flex-col gap-2 border-b border-paper-line pb-6">
        <nav aria-label="Breadcrumb" className="text-small">
          <Link to="/projects" className="font-medium text-tide-800 underline-offset-4 hover:underline">
            Projects
          </Link>
          <span aria-hidden="true" className="px-2 text-ink-muted">
            /
          </span>
          <span className="text-ink-muted">{project.data.name}</span>
        </nav>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-headline font-semibold text-ink">{project.data.name}</h1>
          <ProjectKindBadge kind={project.data.kind} />
        </div>
        {project.data.location ? <p className="text-body text-ink-soft">{project.data.location}</p> : null}
      </header>

      <div className="grid gap-8 md:grid-cols-[13rem_minmax(0,1fr)]">
        <nav aria-label="Project sections">
          <ul className="flex flex-row flex-wrap gap-1 md:flex-col">
            {projectSections.map((section) => (
              <li key={section.slug || 'overview'}>
                <NavLink
                  to={section.slug ? `/projects/${projectId}/${section.slug}` : `/projects/${projectId}`}
                  end={!section.slug}
                  className={sectionLinkClass(section.available)}
                >
                  {section.label}
                  {section.available ? null : (
                    <span className="text-[0.7rem] font-medium uppercase tracking-[0.08em]">
                      <span className="sr-only">(</span>soon<span className="sr-only">: not yet available)</span>
                    </span>
                  )}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <div className="min-w-0">
          <Outlet context={context} />
        </div>
      </div>
    </div>
  );
}
