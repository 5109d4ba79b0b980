import { useState } from 'react';
import type { SavedLoadCase } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { Notice } from '../../../components/ui/notice';
import { RecordCard } from '../../../components/ui/record-card';
import { RemoveControl } from '../../../components/ui/remove-control';
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
          <RecordCard
            key={loadCase.id}
            name={loadCase.name}
            badge={<Badge tone="tide">{loadCaseKindShort[loadCase.spec.kind]}</Badge>}
            summary={summariseLoadCase(loadCase.spec)}
            actions={
              canEdit ? (
                <RemoveControl
                  label={`Remove load case ${loadCase.name}`}
                  confirming={confirming === loadCase.id}
                  busy={deleteLoadCase.isPending}
                  onAsk={() => setConfirming(loadCase.id)}
                  onRemove={() => deleteLoadCase.mutate(loadCase.id, { onSettled: () => setConfirming(null) })}
                  onKeep={() => setConfirming(null)}
                />
              ) : null
            }
          >
            <LoadCaseInfoBox info={describeLoadCase(loadCase.spec)} />
          </RecordCard>
        ))}
      </ul>
    </div>
  );
}
