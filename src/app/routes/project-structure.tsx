import { useQuery } from '@tanstack/react-query';
import { Link, useNavigate, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { designLocks } from '../../components/forms/design-locks';
import { Caution } from '../../components/ui/caution';
import { Loading } from '../../components/ui/loading';
import { PageTitle } from '../../components/ui/page-title';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { signOffsQueryOptions } from '../../features/sign-offs/api/sign-offs';
import { lumpedModelsQueryOptions, modesQueryOptions, structureQueryOptions } from '../../features/structures/api/structures';
import { AddModePanel } from '../../features/structures/components/add-mode-panel';
import { ModesTable } from '../../features/structures/components/modes-table';
import { StructureDetails } from '../../features/structures/components/structure-details';
import { StructureModels } from '../../features/structures/components/structure-models';
import { isApiError } from '../../lib/api-client';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

/** Prefetches the structure, its modes and its models, and the project's sign-offs; failures are shown by the page itself. */
export async function projectStructureLoader({ params }: LoaderFunctionArgs) {
  const projectId = params.projectId ?? '';
  const structureId = params.structureId ?? '';
  const ignore = () => undefined;
  await Promise.all([
    queryClient.ensureQueryData(structureQueryOptions(projectId, structureId)).catch(ignore),
    queryClient.ensureQueryData(modesQueryOptions(projectId, structureId)).catch(ignore),
    queryClient.ensureQueryData(lumpedModelsQueryOptions(projectId, structureId)).catch(ignore),
    // Which modes an approved design holds fast, so that no Edit shows for them even briefly.
    queryClient.ensureQueryData(signOffsQueryOptions(projectId)).catch(ignore),
  ]);
  return null;
}

/** One structure: its details, its design modes and how to add them, and its lumped models. */
export function ProjectStructureRoute() {
  const { project, canEdit } = useProjectContext();
  const { structureId = '' } = useParams();
  const navigate = useNavigate();
  const structure = useQuery(structureQueryOptions(project.id, structureId));
  const modes = useQuery(modesQueryOptions(project.id, structureId));
  const models = useQuery(lumpedModelsQueryOptions(project.id, structureId));
  // Which modes an approved design rests on (fixed) or a submitted one (a change needs a new submission); while the
  // sign-offs are unknown every mode is offered and the server's answer is shown.
  const signOffs = useQuery({ ...signOffsQueryOptions(project.id), enabled: canEdit });
  const locks = designLocks(signOffs.data);
  const back = (
    <Link to={`/projects/${project.id}/structures`} className="text-small font-medium text-tide-800 underline-offset-4 hover:underline">
      ← All structures
    </Link>
  );

  if (structure.isPending) return <Loading label="Loading the structure…" />;
  if (structure.isError) {
    if (isApiError(structure.error) && (structure.error.isNotFound || structure.error.status === 400)) {
      return (
        <div className="flex flex-col items-start gap-3">
          <h2 className="text-title font-semibold text-ink">Structure not found</h2>
          <p className="text-body text-ink-soft">This project has no structure at this address. It may have been deleted.</p>
          {back}
        </div>
      );
    }
    return <QueryError error={structure.error} retry={() => void structure.refetch()} what="the structure" />;
  }

  return (
    <div className="flex flex-col gap-6">
      <PageTitle title={`${structure.data.name} · ${project.name}`} />
      <div className="flex flex-col gap-1">
        {back}
        <h2 className="text-title font-semibold text-ink">{structure.data.name}</h2>
      </div>
      <StructureDetails structure={structure.data} canEdit={canEdit} onDeleted={() => navigate(`/projects/${project.id}/structures`, { replace: true })} />
      <Panel title="Design modes" description="The modes a damper may treat, each with its modal mass for the shape scaled to 1 where the damper sits.">
        {modes.isPending ? (
          <Loading label="Loading the modes…" />
        ) : modes.isError ? (
          <QueryError error={modes.error} retry={() => void modes.refetch()} what="the modes" />
        ) : (
          <ModesTable projectId={project.id} structureId={structureId} modes={modes.data} models={models.data} canEdit={canEdit} locks={locks.modes} />
        )}
      </Panel>
      {canEdit ? <AddModePanel projectId={project.id} structureId={structureId} /> : null}
      {models.isPending ? (
        <Loading label="Loading the lumped models…" />
      ) : models.isError ? (
        <QueryError error={models.error} retry={() => void models.refetch()} what="the lumped models" />
      ) : (
        <StructureModels
          projectId={project.id}
          structureId={structureId}
          models={models.data}
          canEdit={canEdit}
        />
      )}
      <Caution />
    </div>
  );
}
