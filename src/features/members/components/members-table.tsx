import { roles, type Member, type Role } from '../../../../shared/contracts';
import { Notice } from '../../../components/ui/notice';
import { Table, Td, Th } from '../../../components/ui/table';
import { describeError } from '../../../lib/api-client';
import { formatDate, formatRole } from '../../../lib/format';
import { useChangeMemberRole } from '../api/members';

interface MembersTableProps {
  members: Member[];
  /** The signed-in administrator, who cannot change their own role here. */
  currentUserId: string;
}

export function MembersTable({ members, currentUserId }: MembersTableProps) {
  const changeRole = useChangeMemberRole();
  return (
    <div className="flex flex-col gap-4">
      {changeRole.isError ? (
        <Notice tone="error" title="The role was not changed">
          {describeError(changeRole.error)}
        </Notice>
      ) : null}
      {changeRole.isSuccess ? <Notice tone="success" title="Role changed" /> : null}
      <Table caption="Members of the organisation">
        <thead>
          <tr>
            <Th>Name</Th>
            <Th>E-mail</Th>
            <Th>Role</Th>
            <Th>Member since</Th>
          </tr>
        </thead>
        <tbody>
          {members.map((member) => {
            const isSelf = member.userId === currentUserId;
            return (
              <tr key={member.userId}>
                <Td className="font-medium">
                  {member.name}
                  {isSelf ? <span className="ml-2 text-caption text-ink-muted">(you)</span> : null}
                </Td>
                <Td className="text-ink-soft">{member.email}</Td>
                <Td>
                  <label className="sr-only" htmlFor={`role-${member.userId}`}>
                    Role of {member.name}
                  </label>
                  <select
                    id={`role-${member.userId}`}
                    value={member.role}
                    disabled={isSelf || changeRole.isPending}
                    title={isSelf ? 'Another administrator must change your own role.' : undefined}
                    className="rounded-plate border border-paper-line bg-paper-raised px-2 py-1.5 text-small text-ink hover:border-ink-muted disabled:bg-paper-sunk disabled:text-ink-soft"
                    onChange={(event) => changeRole.mutate({ userId: member.userId, role: event.target.value as Role })}
                  >
                    {roles.map((role) => (
                      <option key={role} value={role}>
                        {formatRole(role)}
                      </option>
                    ))}
                  </select>
                </Td>
                <Td className="text-ink-soft">{formatDate(member.joinedAt)}</Td>
              </tr>
            );
          })}
        </tbody>
      </Table>
    </div>
  );
}
