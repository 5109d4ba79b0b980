import type { Invitation } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDate, formatRole } from '../../../lib/format';

const statusLabels: Record<Invitation['status'], string> = { pending: 'Waiting', accepted: 'Accepted', expired: 'Expired' };

export function InvitationsTable({ invitations }: { invitations: Invitation[] }) {
  const pending = invitations.filter((invitation) => invitation.status === 'pending');
  if (pending.length === 0) return <p className="text-small text-ink-muted">No invitations are waiting for an answer.</p>;
  return (
    <Table caption="Pending invitations">
      <thead>
        <tr>
          <Th>E-mail</Th>
          <Th>Role</Th>
          <Th>Sent</Th>
          <Th>Valid until</Th>
          <Th>Status</Th>
        </tr>
      </thead>
      <tbody>
        {pending.map((invitation) => (
          <tr key={invitation.id}>
            <Td className="font-medium">{invitation.email}</Td>
            <Td>{formatRole(invitation.role)}</Td>
            <Td className="text-ink-soft">{formatDate(invitation.createdAt)}</Td>
            <Td className="text-ink-soft">{formatDate(invitation.expiresAt)}</Td>
            <Td>
              <Badge tone="ember">{statusLabels[invitation.status]}</Badge>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
