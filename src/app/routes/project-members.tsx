import { useQuery } from '@tanstack/react-query';
import { Loading } from '../../components/ui/loading';
import { QueryError } from '../../components/ui/query-error';
import { organisationPeopleQueryOptions } from '../../features/members/api/members';
import { projectMembersQueryOptions } from '../../features/projects/api/projects';
import { ProjectMembersPanel } from '../../features/projects/components/project-members-panel';
import { useProjectContext } from './project-layout';

/** The project's people; editors (admins and engineers) add people of the organisation from its people list. */
export function ProjectMembersRoute() {
  const { project, canEdit } = useProjectContext();
  const members = useQuery(projectMembersQueryOptions(project.id));
  const organisation = useQuery({ ...organisationPeopleQueryOptions(), enabled: canEdit });

  if (members.isPending) return <Loading label="Loading the project's members…" />;
  if (members.isError) return <QueryError error={members.error} retry={() => void members.refetch()} what="the project's members" />;
  if (canEdit && organisation.isPending) return <Loading label="Loading the organisation's people…" />;

  return <ProjectMembersPanel projectId={project.id} members={members.data} canEdit={canEdit} candidates={organisation.data ?? null} />;
}
