import { useQuery } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { signOffsQueryOptions } from '../../features/sign-offs/api/sign-offs';
import { HardwareSheetPanel } from '../../features/sign-offs/components/hardware-sheet-panel';
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

/** Hardware sheet: one sheet per approved design, newest first, for the fabricator, with its CSV and PDF. */
export function ProjectHardwareSheetRoute() {
  const { project } = useProjectContext();
  const me = useCurrentUser();
  const signOffs = useQuery(signOffsQueryOptions(project.id));
  if (signOffs.isPending) return <Loading label="Loading the sign-offs…" />;
  if (signOffs.isError) return <QueryError error={signOffs.error} retry={() => void signOffs.refetch()} what="the sign-offs" />;
  const approved = signOffs.data.filter((entry) => entry.status === 'approved');
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title={`Hardware sheet · ${project.name}`} />
      {approved.length === 0 ? (
        <p className="text-small text-ink-soft">No design is approved yet: a hardware sheet exists once the owner approves a design on the Sign-off page.</p>
      ) : (
        approved.map((entry) => (
          <div key={entry.id} className="flex flex-col gap-6">
            <HardwareSheetPanel projectId={project.id} signOffId={entry.id} />
            <AsBuiltSection projectId={project.id} signOff={entry} canRecord={canRecordAsBuilt(me.role)} />
          </div>
        ))
      )}
    </div>
  );
}
