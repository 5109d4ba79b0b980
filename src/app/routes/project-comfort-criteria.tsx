import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Caution } from '../../components/ui/caution';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { comfortCriteriaQueryOptions } from '../../features/comfort-criteria/api/comfort-criteria';
import { CreateCriteriaForm } from '../../features/comfort-criteria/components/criteria-form';
import { CriteriaList } from '../../features/comfort-criteria/components/criteria-list';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

/** Prefetches the project's comfort criteria; a failure is shown by the page itself. */
export async function projectComfortCriteriaLoader({ params }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(comfortCriteriaQueryOptions(params.projectId ?? '')).catch(() => undefined);
  return null;
}

/** The acceleration limits the owner is asked to accept, in plain words with their sources. */
export function ProjectComfortCriteriaRoute() {
  const { project, canEdit } = useProjectContext();
  const criteria = useQuery(comfortCriteriaQueryOptions(project.id));
  const [creating, setCreating] = useState(false);
  const [added, setAdded] = useState(false);
  return (
    <div className="flex flex-col gap-6">
      <Panel
        title="Comfort criteria"
        description="The acceleration limits the structure must meet: a guide's comfort class, a code limit or a project's own numbers. The owner approves them at sign-off."
        actions={
          canEdit && !creating ? (
            <Button
              onClick={() => {
                setAdded(false);
                setCreating(true);
              }}
            >
              New comfort criteria
            </Button>
          ) : undefined
        }
      >
        <div className="flex flex-col gap-4">
          {added ? <Notice tone="success" title="Comfort criteria added" /> : null}
          {criteria.isPending ? (
            <Loading label="Loading the comfort criteria…" />
          ) : criteria.isError ? (
            <QueryError error={criteria.error} retry={() => void criteria.refetch()} what="the comfort criteria" />
          ) : criteria.data.length === 0 ? (
            <p className="text-small text-ink-muted">No comfort criteria yet.</p>
          ) : (
            <CriteriaList projectId={project.id} criteria={criteria.data} canEdit={canEdit} />
          )}
        </div>
      </Panel>
      {creating ? (
        <Panel title="New comfort criteria" description="Choose a guide's class, a code limit or custom numbers; the limits show in plain words as you choose.">
          <div className="flex flex-col gap-4">
            <CreateCriteriaForm
              projectId={project.id}
              onCreated={() => {
                setCreating(false);
                setAdded(true);
              }}
            />
            <div>
              <Button tone="quiet" onClick={() => setCreating(false)}>
                Cancel
              </Button>
            </div>
          </div>
        </Panel>
      ) : null}
      <Caution>Values marked “from memory” could not be checked against their published source: confirm them before a verdict rests on them.</Caution>
    </div>
  );
}
