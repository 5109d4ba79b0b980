import { useState } from 'react';
import type { LumpedModel, SavedMode } from '../../../../shared/contracts';
import { Badge } from '../../../components/ui/badge';
import { Notice } from '../../../components/ui/notice';
import { RemoveControl } from '../../../components/ui/remove-control';
import { Table, Td, Th } from '../../../components/ui/table';
import { Unit } from '../../../components/ui/unit';
import { describeError } from '../../../lib/api-client';
import { formatNumber } from '../../../lib/format';
import { useDeleteMode } from '../api/structures';
import { formatDampingRatio } from './mode-forms';
import { describeModeSource, directionLabels, sourceKindLabels } from './labels';

interface ModesTableProps {
  projectId: string;
  structureId: string;
  modes: SavedMode[];
  models: LumpedModel[] | undefined;
  canEdit: boolean;
}

/** The structure's design modes with where each came from; editors may remove one. */
export function ModesTable({ projectId, structureId, modes, models, canEdit }: ModesTableProps) {
  const deleteMode = useDeleteMode(projectId, structureId);
  const [confirming, setConfirming] = useState<string | null>(null);
  if (modes.length === 0) {
    return <p className="text-small text-ink-muted">No modes yet.{canEdit ? ' Type one in, derive one from a beam or take one from a lumped model below.' : ''}</p>;
  }
  return (
    <div className="flex flex-col gap-3">
      {deleteMode.isError ? (
        <Notice tone="error" title="The mode was not removed">
          {describeError(deleteMode.error)}
        </Notice>
      ) : null}
      <Table caption="Design modes of the structure">
        <thead>
          <tr>
            <Th>Mode</Th>
            <Th>Direction</Th>
            <Th className="text-right">Frequency <Unit>Hz</Unit></Th>
            <Th className="text-right">Modal mass <Unit>kg</Unit></Th>
            <Th className="text-right">Damping ratio <Unit>–</Unit></Th>
            <Th className="text-right">Mean <span className="normal-case">|φ|</span> <Unit>–</Unit></Th>
            <Th>Source</Th>
            {canEdit ? <Th><span className="sr-only">Actions</span></Th> : null}
          </tr>
        </thead>
        <tbody>
          {modes.map((mode) => (
            <tr key={mode.id}>
              <Td className="min-w-[8rem] font-semibold">{mode.label}</Td>
              <Td>{directionLabels[mode.direction]}</Td>
              <Td className="text-right tabular-nums">{formatNumber(mode.frequencyHz, 4)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(mode.modalMassKg, 4)}</Td>
              <Td className="text-right tabular-nums">{formatDampingRatio(mode.dampingRatio)}</Td>
              <Td className="text-right tabular-nums">{mode.modeShapeMean === null ? '—' : formatNumber(mode.modeShapeMean, 3)}</Td>
              <Td className="min-w-[15rem]">
                <div className="flex flex-col items-start gap-1">
                  <Badge tone={mode.source.kind === 'typed' ? 'neutral' : 'tide'}>{sourceKindLabels[mode.source.kind]}</Badge>
                  <span className="text-caption text-ink-muted">{describeModeSource(mode.source, models)}</span>
                </div>
              </Td>
              {canEdit ? (
                <Td className="text-right">
                  <RemoveControl
                    label={`Remove mode ${mode.label}`}
                    confirming={confirming === mode.id}
                    busy={deleteMode.isPending}
                    onAsk={() => setConfirming(mode.id)}
                    onRemove={() => deleteMode.mutate(mode.id, { onSettled: () => setConfirming(null) })}
                    onKeep={() => setConfirming(null)}
                    className="flex justify-end gap-2"
                  />
                </Td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}
