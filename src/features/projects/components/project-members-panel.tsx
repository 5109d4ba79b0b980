import { useState } from 'react';
import type { Member, ProjectMember } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { Table, Td, Th } from '../../../components/ui/table';
import { describeError } from '../../../lib/api-client';
import { formatDate, formatRole } from '../../../lib/format';
import { useAddProjectMember, useRemoveProjectMember } from '../api/projects';

interface ProjectMembersPanelProps {
  projectId: string;
  members: ProjectMember[];
  canEdit: boolean;
  /** The organisation's people, who could be added to the project; null when the list could not be loaded. */
  candidates: Member[] | null;
}

export function ProjectMembersPanel({ projectId, members, canEdit, candidates }: ProjectMembersPanelProps) {
  const removeMember = useRemoveProjectMember(projectId);
  return (
    <div className="flex flex-col gap-6">
      <Panel title="People on this project" description="A member's role on the project is their role in the organisation.">
        {removeMember.isError ? (
          <div className="mb-4">
            <Notice tone="error" title="The member was not removed">
              {describeError(removeMember.error)}
            </Notice>
          </div>
        ) : null}
        {members.length === 0 ? (
          <p className="text-small text-ink-muted">Nobody has been added to this project yet.</p>
        ) : (
          <Table caption="Project members">
            <thead>
              <tr>
                <Th>Name</Th>
                <Th>E-mail</Th>
                <Th>Role</Th>
                <Th>Added</Th>
                {canEdit ? <Th className="text-right">Action</Th> : null}
              </tr>
            </thead>
            <tbody>
              {members.map((member) => (
                <tr key={member.userId}>
                  <Td className="font-medium">{member.name}</Td>
                  <Td className="text-ink-soft">{member.email}</Td>
                  <Td>
                    <Badge tone="tide">{formatRole(member.role)}</Badge>
                  </Td>
                  <Td className="text-ink-soft">{formatDate(member.addedAt)}</Td>
                  {canEdit ? (
                    <Td className="text-right">
                      <Button
                        tone="quiet"
                        aria-label={`Remove ${member.name} from the project`}
                        busy={removeMember.isPending && removeMember.variables === member.userId}
                        onClick={() => removeMember.mutate(member.userId)}
                      >
                        Remove
                      </Button>
                    </Td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </Table>
        )}
      </Panel>
      {canEdit ? <AddProjectMember projectId={projectId} members={members} candidates={candidates} /> : null}
    </div>
  );
}

function AddProjectMember({ projectId, members, candidates }: { projectId: string; members: ProjectMember[]; candidates: Member[] | null }) {
  const addMember = useAddProjectMember(projectId);
  const [userId, setUserId] = useState('');
  const [fieldError, setFieldError] = useState<string | undefined>();

  if (candidates === null) {
    return (
      <Panel title="Add a member">
        <p className="text-small text-ink-muted">
          The organisation&apos;s list of people could not be loaded, so nobody can be added just now. Reload the page to
          try again; you can still remove members here.
        </p>
      </Panel>
    );
  }

  const onProject = new Set(members.map((member) => member.userId));
  const available = candidates.filter((candidate) => !onProject.has(candidate.userId));

  return (
    <Panel title="Add a member" description="Add someone from your organisation to this project.">
      {available.length === 0 ? (
        <p className="text-small text-ink-muted">Everyone in the organisation is already on this project.</p>
      ) : (
        <form
          noValidate
          aria-label="Add a project member"
          className="flex flex-col gap-4 sm:flex-row sm:items-end"
          onSubmit={(event) => {
            event.preventDefault();
            if (!userId) {
              setFieldError('Choose a person to add.');
              return;
            }
            setFieldError(undefined);
            addMember.mutate(
              { userId },
              {
                onSuccess: () => setUserId(''),
                onError: (error) => setFieldError(describeError(error)),
              },
            );
          }}
        >
          <div className="sm:w-96">
            <SelectField label="Person" value={userId} error={fieldError} onChange={(event) => setUserId(event.target.value)}>
              <option value="">Choose a person…</option>
              {available.map((candidate) => (
                <option key={candidate.userId} value={candidate.userId}>
                  {candidate.name} — {formatRole(candidate.role)} ({candidate.email})
                </option>
              ))}
            </SelectField>
          </div>
          <Button type="submit" busy={addMember.isPending} className={fieldError ? 'sm:mb-6' : ''}>
            Add to project
          </Button>
        </form>
      )}
    </Panel>
  );
}
