import { useQuery } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import type { SignOff } from '../../../shared/contracts/sign-offs';
import { describeCriteria } from '../../features/comfort-criteria/components/criteria-info';
import { LimitLines } from '../../features/comfort-criteria/components/limit-lines';
import { projectMembersQueryOptions } from '../../features/projects/api/projects';
import { signOffsQueryOptions } from '../../features/sign-offs/api/sign-offs';
import { HardwareSheetPanel } from '../../features/sign-offs/components/hardware-sheet-panel';
import { SignOffDecision } from '../../features/sign-offs/components/sign-off-decision';
import { SignOffTimeline } from '../../features/sign-offs/components/sign-off-timeline';
import { Loading } from '../../components/ui/loading';
import { PageTitle } from '../../components/ui/page-title';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { queryClient } from '../../lib/query-client';
import { useCurrentUser } from '../session';
import { useProjectContext } from './project-layout';

const criteriaInWords = (signOff: SignOff) => <LimitLines lines={describeCriteria(signOff.snapshot.criteria.spec)} />;

/** Prefetches the project's sign-offs; a failure is shown by the page itself. */
export async function projectSignOffLoader({ params }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(signOffsQueryOptions(params.projectId ?? '')).catch(() => undefined);
  return null;
}

/** Sign-off: the designs awaiting the owner's decision, read as a decision, and the timeline of every sign-off. */
export function ProjectSignOffRoute() {
  const { project } = useProjectContext();
  const me = useCurrentUser();
  const signOffs = useQuery(signOffsQueryOptions(project.id));
  const members = useQuery(projectMembersQueryOptions(project.id));
  const personName = (userId: string | null): string => {
    if (!userId) return 'a former member';
    if (userId === me.id) return 'you';
    return members.data?.find((m) => m.userId === userId)?.name ?? 'a member of the organisation';
  };

  if (signOffs.isPending) return <Loading label="Loading the sign-offs…" />;
  if (signOffs.isError) return <QueryError error={signOffs.error} retry={() => void signOffs.refetch()} what="the sign-offs" />;
  const awaiting = signOffs.data.filter((entry) => entry.status === 'submitted');
  const approved = signOffs.data.filter((entry) => entry.status === 'approved');
  return (
    <div className="flex flex-col gap-6">
      <PageTitle title={`Sign-off · ${project.name}`} />
      {awaiting.length === 0 ? (
        <p className="text-small text-ink-soft">No design awaits a decision.</p>
      ) : (
        awaiting.map((entry) => (
          <SignOffDecision
            key={entry.id}
            projectId={project.id}
            signOff={entry}
            canDecide={me.role === 'owner'}
            personName={personName}
            criteriaInWords={criteriaInWords(entry)}
          />
        ))
      )}
      {approved.map((entry) => (
        <HardwareSheetPanel key={entry.id} projectId={project.id} signOffId={entry.id} />
      ))}
      <Panel title="Sign-off timeline" description="Every design submitted to the owner, newest first, with the decision and the mails it sent.">
        <SignOffTimeline signOffs={signOffs.data} personName={personName} projectId={project.id} criteriaInWords={criteriaInWords} />
      </Panel>
    </div>
  );
}
