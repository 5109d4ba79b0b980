import { useQuery } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { designLocks } from '../../components/forms/design-locks';
import { CollectionPage } from '../../components/layouts/collection-page';
import { loadCasesQueryOptions } from '../../features/load-cases/api/load-cases';
import { LoadCaseForm } from '../../features/load-cases/components/load-case-form';
import { LoadCaseList } from '../../features/load-cases/components/load-case-list';
import { signOffsQueryOptions } from '../../features/sign-offs/api/sign-offs';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

/** Prefetches the project's load cases and sign-offs; a failure is shown by the page itself. */
export async function projectLoadCasesLoader({ params }: LoaderFunctionArgs) {
  const projectId = params.projectId ?? '';
  // The sign-offs tell which load cases an approved design holds fast, so that no Edit shows for them even briefly.
  await Promise.all([
    queryClient.ensureQueryData(loadCasesQueryOptions(projectId)).catch(() => undefined),
    queryClient.ensureQueryData(signOffsQueryOptions(projectId)).catch(() => undefined),
  ]);
  return null;
}

/** The project's load cases, each from a named guide with the frequencies it covers. */
export function ProjectLoadCasesRoute() {
  const { project, canEdit } = useProjectContext();
  const loadCases = useQuery(loadCasesQueryOptions(project.id));
  // Which load cases an approved design rests on (fixed) or a submitted one (a change needs a new submission); while
  // the sign-offs are unknown every load case is offered and the server's answer is shown.
  const signOffs = useQuery({ ...signOffsQueryOptions(project.id), enabled: canEdit });
  const locks = designLocks(signOffs.data);
  return (
    <CollectionPage
      query={loadCases}
      canEdit={canEdit}
      title="Load cases"
      description="How people load the structure: a crowd by density class, a lateral crowd, one walker or jogger, a walker crossing the span, floor walking — each from the guide it names."
      plural="load cases"
      newLabel="New load case"
      newDescription="Choose the kind and the guide's choices; the source it follows and the frequencies it covers show as you go."
      addedTitle="Load case added"
      renderList={(items) => <LoadCaseList projectId={project.id} loadCases={items} canEdit={canEdit} locks={locks.loadCases} />}
      renderCreateForm={(onCreated) => <LoadCaseForm projectId={project.id} onDone={onCreated} />}
    />
  );
}
