import { useState } from 'react';
import type { ComfortCriteria } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
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
          <li key={entry.id} className="flex flex-col gap-3 rounded-plate border border-paper-line bg-paper-raised p-4">
            <div className="flex flex-wrap items-start justify-between gap-3">
              <div className="flex flex-col gap-1">
                <div className="flex flex-wrap items-center gap-2">
                  <h3 className="text-body font-semibold text-ink">{entry.name}</h3>
                  <Badge tone={entry.status === 'approved' ? 'tide' : 'ember'}>{statusLabels[entry.status]}</Badge>
                </div>
                <p className="text-small text-ink-soft">{criteriaTitle(entry.spec)}</p>
              </div>
              {canEdit && entry.status === 'draft' ? (
                confirming === entry.id ? (
                  <span className="flex gap-2">
                    <Button tone="danger" busy={deleteCriteria.isPending} onClick={() => deleteCriteria.mutate(entry.id, { onSettled: () => setConfirming(null) })}>
                      Remove
                    </Button>
                    <Button tone="quiet" onClick={() => setConfirming(null)}>
                      Keep
                    </Button>
                  </span>
                ) : (
                  <Button tone="quiet" aria-label={`Remove comfort criteria ${entry.name}`} onClick={() => setConfirming(entry.id)}>
                    Remove…
                  </Button>
                )
              ) : null}
            </div>
            <div className="text-small text-ink">
              <LimitLines lines={describeCriteria(entry.spec)} />
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}
