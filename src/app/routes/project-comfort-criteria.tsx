import { useQuery } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { CollectionPage } from '../../components/layouts/collection-page';
import { comfortCriteriaQueryOptions } from '../../features/comfort-criteria/api/comfort-criteria';
import { CriteriaForm } from '../../features/comfort-criteria/components/criteria-form';
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
  return (
    <CollectionPage
      query={criteria}
      canEdit={canEdit}
      title="Comfort criteria"
      description="The acceleration limits the structure must meet: a guide's comfort class, a code limit or a project's own numbers. The owner approves them at sign-off."
      plural="comfort criteria"
      newLabel="New comfort criteria"
      newDescription="Choose a guide's class, a code limit or custom numbers; the limits show in plain words as you choose."
      addedTitle="Comfort criteria added"
      caution="Values marked “from memory” could not be checked against their published source: confirm them before a verdict rests on them."
      renderList={(items) => <CriteriaList projectId={project.id} criteria={items} canEdit={canEdit} />}
      renderCreateForm={(onCreated) => <CriteriaForm projectId={project.id} onDone={onCreated} />}
    />
  );
}
