import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate, type LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Loading } from '../../components/ui/loading';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { structuresQueryOptions } from '../../features/structures/api/structures';
import { CreateStructureForm } from '../../features/structures/components/structure-forms';
import { StructureList } from '../../features/structures/components/structure-list';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

/** Prefetches the project's structures; a failure is shown by the page itself. */
export async function projectStructuresLoader({ params }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(structuresQueryOptions(params.projectId ?? '')).catch(() => undefined);
  return null;
}

/** The project's structures (footbridge spans, floor bays), each with its modes and lumped models. */
export function ProjectStructuresRoute() {
  const { project, canEdit } = useProjectContext();
  const structures = useQuery(structuresQueryOptions(project.id));
  const [creating, setCreating] = useState(false);
  const navigate = useNavigate();

  return (
    <div className="flex flex-col gap-6">
      <Panel
        title="Structures and modes"
        description="Each structure — a footbridge span or a floor bay — holds its design modes (natural frequency, modal mass, damping ratio, direction) and its lumped models."
        actions={
          canEdit && !creating ? (
            <Button aria-expanded={creating} onClick={() => setCreating(true)}>
              New structure
            </Button>
          ) : undefined
        }
      >
        {structures.isPending ? (
          <Loading label="Loading the structures…" />
        ) : structures.isError ? (
          <QueryError error={structures.error} retry={() => void structures.refetch()} what="the structures" />
        ) : structures.data.length === 0 ? (
          <p className="text-small text-ink-muted">No structures yet.{canEdit ? ' Add the span or bay whose modes you will check.' : ''}</p>
        ) : (
          <StructureList projectId={project.id} structures={structures.data} />
        )}
      </Panel>
      {creating ? (
        <Panel title="New structure" description="Name the span or bay; its dimensions can follow.">
          <CreateStructureForm
            projectId={project.id}
            onCreated={(structure) => navigate(`/projects/${project.id}/structures/${structure.id}`)}
            onCancel={() => setCreating(false)}
          />
        </Panel>
      ) : null}
    </div>
  );
}
