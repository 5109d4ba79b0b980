import { useNavigate } from 'react-router-dom';
import { ProjectOverview } from '../../features/projects/components/project-overview';
import { useProjectContext } from './project-layout';

export function ProjectOverviewRoute() {
  const { project, canEdit, reload } = useProjectContext();
  const navigate = useNavigate();
  return (
    <ProjectOverview project={project} canEdit={canEdit} onReload={reload} onDeleted={() => navigate('/projects', { replace: true })} />
  );
}
