import { Link } from 'react-router-dom';
import type { Project } from '../../../../shared/contracts';
import { formatDate } from '../../../lib/format';
import { ProjectKindBadge } from './project-kind-badge';

export function ProjectList({ projects, highlightId }: { projects: Project[]; highlightId?: string | null }) {
  return (
    <ul aria-label="Projects" className="grid gap-4 md:grid-cols-2">
      {projects.map((project) => (
        <li
          key={project.id}
          className={`group relative flex flex-col gap-2 rounded-plate border bg-paper-raised p-5 transition-shadow hover:shadow-md ${
            project.id === highlightId ? 'border-tide-500 ring-2 ring-tide-200' : 'border-paper-line'
          }`}
        >
          <div className="flex items-start justify-between gap-3">
            <h2 className="text-lead font-semibold">
              <Link
                to={`/projects/${project.id}`}
                className="text-ink after:absolute after:inset-0 after:content-[''] group-hover:text-tide-800"
              >
                {project.name}
              </Link>
            </h2>
            <ProjectKindBadge kind={project.kind} />
          </div>
          {project.location ? <p className="text-small text-ink-soft">{project.location}</p> : null}
          {project.description ? <p className="line-clamp-2 text-small text-ink-muted">{project.description}</p> : null}
          <p className="mt-auto pt-2 text-caption text-ink-muted">Updated {formatDate(project.updatedAt)}</p>
        </li>
      ))}
    </ul>
  );
}
