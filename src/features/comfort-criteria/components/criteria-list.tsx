import { useState } from 'react';
import type { ComfortCriteria } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { RecordCard } from '../../../components/ui/record-card';
import { RemoveControl } from '../../../components/ui/remove-control';
import { describeError } from '../../../lib/api-client';
import { useDeleteComfortCriteria, useReloadComfortCriteria } from '../api/comfort-criteria';
import { CriteriaForm } from './criteria-form';
import { criteriaTitle, describeCriteria } from './criteria-info';
import { LimitLines } from './limit-lines';

const statusLabels: Record<ComfortCriteria['status'], string> = {
  draft: 'Draft — not yet submitted to the owner',
  submitted: 'Submitted to the owner',
  approved: 'Approved by the owner',
  returned: 'Returned by the owner',
};

/**
 * The project's comfort criteria. Editors may change drafts and returned criteria, and submitted ones at the cost of
 * the submission; approved criteria are fixed (the design the owner approved rests on them). Only drafts can be removed.
 */
export function CriteriaList({ projectId, criteria, canEdit }: { projectId: string; criteria: ComfortCriteria[]; canEdit: boolean }) {
  const deleteCriteria = useDeleteComfortCriteria(projectId);
  const [confirming, setConfirming] = useState<string | null>(null);
  const [editingId, setEditingId] = useState<string | null>(null);
  const [savedId, setSavedId] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-3">
      {deleteCriteria.isError ? (
        <Notice tone="error" title="The comfort criteria were not removed">
          {describeError(deleteCriteria.error)}
        </Notice>
      ) : null}
      <ul aria-label="Comfort criteria" className="flex flex-col gap-4">
        {criteria.map((entry) => {
          const fixed = entry.status === 'approved';
          // A form already open stays open when the criteria are approved meanwhile, to show the refusal of its save.
          const editing = canEdit && editingId === entry.id;
          return (
            <RecordCard
              key={entry.id}
              name={entry.name}
              badge={<Badge tone={entry.status === 'approved' ? 'tide' : 'ember'}>{statusLabels[entry.status]}</Badge>}
              summary={criteriaTitle(entry.spec)}
              actions={
                !canEdit || editing || fixed ? null : (
                  <div className="flex gap-2">
                    {confirming === entry.id ? null : (
                      <Button
                        tone="quiet"
                        aria-label={`Edit comfort criteria ${entry.name}`}
                        onClick={() => {
                          setSavedId(null);
                          setEditingId(entry.id);
                        }}
                      >
                        Edit
                      </Button>
                    )}
                    {entry.status === 'draft' ? (
                      <RemoveControl
                        label={`Remove comfort criteria ${entry.name}`}
                        confirming={confirming === entry.id}
                        busy={deleteCriteria.isPending}
                        onAsk={() => setConfirming(entry.id)}
                        onRemove={() => deleteCriteria.mutate(entry.id, { onSettled: () => setConfirming(null) })}
                        onKeep={() => setConfirming(null)}
                      />
                    ) : null}
                  </div>
                )
              }
            >
              {savedId === entry.id ? <Notice tone="success" title="Comfort criteria saved" /> : null}
              {canEdit && fixed && !editing ? (
                <p className="text-small text-ink-soft">
                  The design the owner approved rests on these criteria, so they cannot be changed. For other limits, add new
                  criteria and submit a design with them for sign-off.
                </p>
              ) : null}
              {editing ? (
                <EditCriteria
                  projectId={projectId}
                  criteria={entry}
                  onSaved={() => {
                    setSavedId(entry.id);
                    setEditingId(null);
                  }}
                  onCancel={() => setEditingId(null)}
                />
              ) : (
                <div className="text-small text-ink">
                  <LimitLines lines={describeCriteria(entry.spec)} />
                </div>
              )}
            </RecordCard>
          );
        })}
      </ul>
    </div>
  );
}

interface EditCriteriaProps {
  projectId: string;
  criteria: ComfortCriteria;
  onSaved: () => void;
  onCancel: () => void;
}

/** The criteria form opened on the stored criteria, inside their card, with what a change means for the sign-off. */
function EditCriteria({ projectId, criteria, onSaved, onCancel }: EditCriteriaProps) {
  const reloadCriteria = useReloadComfortCriteria(projectId);
  // Bumped after a reload, so that the form opens again on the stored criteria.
  const [opening, setOpening] = useState(0);
  return (
    <div className="flex flex-col gap-4 border-t border-paper-line pt-4">
      {criteria.status === 'submitted' ? (
        <Notice tone="caution" title="A change will need a new sign-off">
          These criteria are with the owner for sign-off. After a change the owner can no longer approve the design as
          submitted: it will have to be returned and submitted again with the new criteria.
        </Notice>
      ) : null}
      {criteria.status === 'returned' ? (
        <p className="text-small text-ink-soft">The owner returned these criteria; once changed, submit the design again for sign-off.</p>
      ) : null}
      <CriteriaForm
        key={opening}
        projectId={projectId}
        criteria={criteria}
        onDone={onSaved}
        onCancel={onCancel}
        onReload={async () => {
          await reloadCriteria();
          setOpening((count) => count + 1);
        }}
      />
    </div>
  );
}
