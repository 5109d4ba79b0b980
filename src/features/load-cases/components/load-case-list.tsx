import { useState } from 'react';
import type { SavedLoadCase } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { describeError } from '../../../lib/api-client';
import { useDeleteLoadCase } from '../api/load-cases';
import { describeLoadCase, loadCaseKindShort, summariseLoadCase } from './load-case-info';
import { LoadCaseInfoBox } from './load-case-info-box';

export function LoadCaseList({ projectId, loadCases, canEdit }: { projectId: string; loadCases: SavedLoadCase[]; canEdit: boolean }) {
  const deleteLoadCase = useDeleteLoadCase(projectId);
  const [confirming, setConfirming] = useState<string | null>(null);
  return (
    <div className="flex flex-col gap-3">
      {deleteLoadCase.isError ? (
        <Notice tone="error" title="The load case was not removed">
          {describeError(deleteLoadCase.error)}
        </Notice>
      ) : null}
      <ul aria-label="Load cases" className="flex flex-col gap-4">
        {loadCases.map((loadCase) => (
          <li key={loadCase.id} className="flex flex-col gap-3 rounded-plate border border-paper-line bg-paper-raised p-4">
            <div className="flex flex-wrap items-start justify-between gap-3">
              <div className="flex flex-col gap-1">
                <div className="flex flex-wrap items-center gap-2">
                  <h3 className="text-body font-semibold text-ink">{loadCase.name}</h3>
                  <Badge tone="tide">{loadCaseKindShort[loadCase.spec.kind]}</Badge>
                </div>
                <p className="text-small text-ink-soft">{summariseLoadCase(loadCase.spec)}</p>
              </div>
              {canEdit ? (
                confirming === loadCase.id ? (
                  <span className="flex gap-2">
                    <Button tone="danger" busy={deleteLoadCase.isPending} onClick={() => deleteLoadCase.mutate(loadCase.id, { onSettled: () => setConfirming(null) })}>
                      Remove
                    </Button>
                    <Button tone="quiet" onClick={() => setConfirming(null)}>
                      Keep
                    </Button>
                  </span>
                ) : (
                  <Button tone="quiet" aria-label={`Remove load case ${loadCase.name}`} onClick={() => setConfirming(loadCase.id)}>
                    Remove…
                  </Button>
                )
              ) : null}
            </div>
            <LoadCaseInfoBox info={describeLoadCase(loadCase.spec)} />
          </li>
        ))}
      </ul>
    </div>
  );
}
