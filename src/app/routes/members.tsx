import { canManageMembers } from '../../../shared/contracts';
import { useQuery } from '@tanstack/react-query';
import { Loading } from '../../components/ui/loading';
import { Notice } from '../../components/ui/notice';
import { PageHeader } from '../../components/ui/page-header';
import { Panel } from '../../components/ui/panel';
import { QueryError } from '../../components/ui/query-error';
import { organisationMembersQueryOptions } from '../../features/members/api/members';
import { InvitationsTable } from '../../features/members/components/invitations-table';
import { InviteForm } from '../../features/members/components/invite-form';
import { MembersTable } from '../../features/members/components/members-table';
import { useCurrentUser } from '../session';
import { PageTitle } from '../../components/ui/page-title';

export function MembersRoute() {
  const me = useCurrentUser();
  const isAdmin = canManageMembers(me.role);
  const list = useQuery({ ...organisationMembersQueryOptions(), enabled: isAdmin });

  return (
    <div className="flex flex-col gap-8">
      <PageTitle title="Members" />
      <PageHeader eyebrow={me.organisation.name} title="Members" lead="The organisation's people, their roles and the invitations still open." />
      {!isAdmin ? (
        <Notice tone="caution" title="Administrators only">
          Only an administrator of {me.organisation.name} manages its people and their roles.
        </Notice>
      ) : (
        <>
          <Panel title="Invite a person" description="They receive an e-mail with a link to set their name and password.">
            <InviteForm />
          </Panel>
          {list.isPending ? (
            <Loading label="Loading members…" />
          ) : list.isError ? (
            <QueryError error={list.error} retry={() => void list.refetch()} what="the members" />
          ) : (
            <>
              <Panel title="Pending invitations">
                <InvitationsTable invitations={list.data.invitations} />
              </Panel>
              <Panel title="People" description="Change a person's role with the menu in their row.">
                <MembersTable members={list.data.members} currentUserId={me.id} />
              </Panel>
            </>
          )}
        </>
      )}
    </div>
  );
}
