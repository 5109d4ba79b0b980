import { useState } from 'react';
import type { ComfortCriteria } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { Notice } from '../../../components/ui/notice';
import { RecordCard } from '../../../components/ui/record-card';
import { RemoveControl } from '../../../components/ui/remove-control';
import { describeError } from '../../../lib/api-client';
import { useDeleteComfortCriteria } from '../api/comfort-criteria';
import { criteriaTitle, describeCriteria } from './criteria-info';
import { LimitLines } from './limit-lines';

const statusLabels: Record<ComfortCriteria['status'], string> = {
  draft: 'Draft — not yet submitted to the owner',
  submitted: 'Submitted to the owner',
  approved: 'Approved by the owner',
  returned: 'Returned by the owner',
};

export function CriteriaList({ projectId, criteria, canEdit }: { projectId: string; criteria: ComfortCriteria[]; canEdit: boolean }) {
  const deleteCriteria = useDeleteComfortCriteria(projectId);
  const [confirming, setConfirming] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-3">
      {deleteCriteria.isError ? (
        <Notice tone="error" title="The comfort criteria were not removed">
          {describeError(deleteCriteria.error)}
        </Notice>
      ) : null}
      <ul aria-label="Comfort criteria" className="flex flex-col gap-4">
        {criteria.map((entry) => (
          <RecordCard
            key={entry.id}
            name={entry.name}
            badge={<Badge tone={entry.status === 'approved' ? 'tide' : 'ember'}>{statusLabels[entry.status]}</Badge>}
            summary={criteriaTitle(entry.spec)}
            actions={
              canEdit && entry.status === 'draft' ? (
                <RemoveControl
                  label={`Remove comfort criteria ${entry.name}`}
                  confirming={confirming === entry.id}
                  busy={deleteCriteria.isPending}
                  onAsk={() => setConfirming(entry.id)}
                  onRemove={() => deleteCriteria.mutate(entry.id, { onSettled: () => setConfirming(null) })}
                  onKeep={() => setConfirming(null)}
                />
              ) : null
            }
          >
            <div className="text-small text-ink">
              <LimitLines lines={describeCriteria(entry.spec)} />
            </div>
          </RecordCard>
        ))}
      </ul>
    </div>
  );
}
