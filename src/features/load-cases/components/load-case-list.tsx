import { useState } from 'react';
import type { SavedLoadCase } from '../../../../shared/contracts';
import { noLocks, type DesignLocks } from '../../../components/forms/design-locks';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { RecordCard } from '../../../components/ui/record-card';
import { RemoveControl } from '../../../components/ui/remove-control';
import { describeError } from '../../../lib/api-client';
import { useDeleteLoadCase, useReloadLoadCases } from '../api/load-cases';
import { LoadCaseForm } from './load-case-form';
import { describeLoadCase, loadCaseKindShort, summariseLoadCase } from './load-case-info';
import { LoadCaseInfoBox } from './load-case-info-box';

interface LoadCaseListProps {
  projectId: string;
  loadCases: SavedLoadCase[];
  canEdit: boolean;
  /** The load cases that sign-offs rest on: approved ones are fixed, pending ones can change at the cost of the submission. */
  locks?: DesignLocks;
}

/** The project's load cases; editors may change or remove one, except one an approved design rests on. */
export function LoadCaseList({ projectId, loadCases, canEdit, locks = noLocks }: LoadCaseListProps) {
  const deleteLoadCase = useDeleteLoadCase(projectId);
  const [confirming, setConfirming] = useState<string | null>(null);
  const [editingId, setEditingId] = useState<string | null>(null);
  const [savedId, setSavedId] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-3">
      {deleteLoadCase.isError ? (
        <Notice tone="error" title="The load case was not removed">
          {describeError(deleteLoadCase.error)}
        </Notice>
      ) : null}
      <ul aria-label="Load cases" className="flex flex-col gap-4">
        {loadCases.map((loadCase) => {
          const fixed = locks.approved.has(loadCase.id);
          // A form already open stays open when an approved design comes to rest on it meanwhile, to show the refusal.
          const editing = canEdit && editingId === loadCase.id;
          return (
            <RecordCard
              key={loadCase.id}
              name={loadCase.name}
              badge={<Badge tone="tide">{loadCaseKindShort[loadCase.spec.kind]}</Badge>}
              summary={summariseLoadCase(loadCase.spec)}
              actions={
                !canEdit || editing || fixed ? null : (
                  <div className="flex gap-2">
                    {confirming === loadCase.id ? null : (
                      <Button
                        tone="quiet"
                        aria-label={`Edit load case ${loadCase.name}`}
                        onClick={() => {
                          setSavedId(null);
                          setEditingId(loadCase.id);
                        }}
                      >
                        Edit
                      </Button>
                    )}
                    <RemoveControl
                      label={`Remove load case ${loadCase.name}`}
                      confirming={confirming === loadCase.id}
                      busy={deleteLoadCase.isPending}
                      onAsk={() => setConfirming(loadCase.id)}
                      onRemove={() => deleteLoadCase.mutate(loadCase.id, { onSettled: () => setConfirming(null) })}
                      onKeep={() => setConfirming(null)}
                    />
                  </div>
                )
              }
            >
              {savedId === loadCase.id ? <Notice tone="success" title="Load case saved" /> : null}
              {canEdit && fixed && !editing ? (
                <p className="text-small text-ink-soft">
                  The design the owner approved rests on this load case, so it cannot be changed or removed. For another load,
                  add a new load case.
                </p>
              ) : null}
              {editing ? (
                <EditLoadCase
                  projectId={projectId}
                  loadCase={loadCase}
                  pendingSignOff={locks.pending.has(loadCase.id)}
                  onSaved={() => {
                    setSavedId(loadCase.id);
                    setEditingId(null);
                  }}
                  onCancel={() => setEditingId(null)}
                />
              ) : (
                <LoadCaseInfoBox info={describeLoadCase(loadCase.spec)} />
              )}
            </RecordCard>
          );
        })}
      </ul>
    </div>
  );
}

interface EditLoadCaseProps {
  projectId: string;
  loadCase: SavedLoadCase;
  pendingSignOff: boolean;
  onSaved: () => void;
  onCancel: () => void;
}

/** The load case form opened on the stored load case, inside its card. */
function EditLoadCase({ projectId, loadCase, pendingSignOff, onSaved, onCancel }: EditLoadCaseProps) {
  const reloadLoadCases = useReloadLoadCases(projectId);
  // Bumped after a reload, so that the form opens again on the stored load case.
  const [opening, setOpening] = useState(0);
  return (
    <div className="flex flex-col gap-4 border-t border-paper-line pt-4">
      {pendingSignOff ? (
        <Notice tone="caution" title="Waiting for the owner's sign-off">
          A design submitted to the owner rests on this load case. After a change the owner can no longer approve it as
          submitted: it will have to be returned and submitted again.
        </Notice>
      ) : null}
      <LoadCaseForm
        key={opening}
        projectId={projectId}
        loadCase={loadCase}
        onDone={onSaved}
        onCancel={onCancel}
        onReload={async () => {
          await reloadLoadCases();
          setOpening((count) => count + 1);
        }}
      />
    </div>
  );
}
