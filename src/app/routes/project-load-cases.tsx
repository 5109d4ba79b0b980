import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { Caution } from '../../components/ui/caution';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { loadCasesQueryOptions } from '../../features/load-cases/api/load-cases';
import { CreateLoadCaseForm } from '../../features/load-cases/components/load-case-form';
import { LoadCaseList } from '../../features/load-cases/components/load-case-list';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

/** Prefetches the project's load cases; a failure is shown by the page itself. */
export async function projectLoadCasesLoader({ params }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(loadCasesQueryOptions(params.projectId ?? '')).catch(() => undefined);
  return null;
}

/** The project's load cases, each from a named guide with the frequencies it covers. */
export function ProjectLoadCasesRoute() {
  const { project, canEdit } = useProjectContext();
  const loadCases = useQuery(loadCasesQueryOptions(project.id));
  const [creating, setCreating] = useState(false);
  const [added, setAdded] = useState(false);
  return (
    <div className="flex flex-col gap-6">
      <Panel
        title="Load cases"
        description="How people load the structure: a crowd by density class, a lateral crowd, one walker or jogger, a walker crossing the span, floor walking — each from the guide it names."
        actions={
          canEdit && !creating ? (
            <Button
              onClick={() => {
                setAdded(false);
                setCreating(true);
              }}
            >
              New load case
            </Button>
          ) : undefined
        }
      >
        <div className="flex flex-col gap-4">
          {added ? <Notice tone="success" title="Load case added" /> : null}
          {loadCases.isPending ? (
            <Loading label="Loading the load cases…" />
          ) : loadCases.isError ? (
            <QueryError error={loadCases.error} retry={() => void loadCases.refetch()} what="the load cases" />
          ) : loadCases.data.length === 0 ? (
            <p className="text-small text-ink-muted">No load cases yet.</p>
          ) : (
            <LoadCaseList projectId={project.id} loadCases={loadCases.data} canEdit={canEdit} />
          )}
        </div>
      </Panel>
      {creating ? (
        <Panel title="New load case" description="Choose the kind and the guide's choices; the source it follows and the frequencies it covers show as you go.">
          <div className="flex flex-col gap-4">
            <CreateLoadCaseForm
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
      <Caution />
    </div>
  );
}
