import { useQuery } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { signOffsQueryOptions } from '../../features/sign-offs/api/sign-offs';
import { HardwareSheetList } from '../../features/sign-offs/components/hardware-sheet-list';
import { AsBuiltSection } from '../../features/as-built/components/as-built-section';
import { canRecordAsBuilt } from '../../../shared/contracts/as-built';
import { useCurrentUser } from '../session';
import { Loading } from '../../components/ui/loading';
import { PageTitle } from '../../components/ui/page-title';
import { QueryError } from '../../components/ui/query-error';
import { queryClient } from '../../lib/query-client';
import { useProjectContext } from './project-layout';

export async function projectHardwareSheetLoader({ params }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(signOffsQueryOptions(params.projectId ?? '')).catch(() => undefined);
  return null;
}

/** Hardware sheet: one sheet per approved design, newest first, for the fabricator, with its CSV and PDF, and the caution. */
export function ProjectHardwareSheetRoute() {
  const { project } = useProjectContext();
  const me = useCurrentUser();
  const signOffs = useQuery(signOffsQueryOptions(project.id));
  if (signOffs.isPending) return <Loading label="Loading the sign-offs…" />;
  if (signOffs.isError) return <QueryError error={signOffs.error} retry={() => void signOffs.refetch()} what="the sign-offs" />;
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title={`Hardware sheet · ${project.name}`} />
      <HardwareSheetList
        projectId={project.id}
        signOffs={signOffs.data}
        afterSheet={(entry) => <AsBuiltSection projectId={project.id} signOff={entry} canRecord={canRecordAsBuilt(me.role)} />}
      />
    </div>
  );
}
