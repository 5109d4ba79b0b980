import { useState } from 'react';
import type { LumpedModel, SavedMode } from '../../../../shared/contracts';
import { noLocks, type DesignLocks } from '../../../components/forms/design-locks';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { RemoveControl } from '../../../components/ui/remove-control';
import { Table, Td, Th } from '../../../components/ui/table';
import { Unit } from '../../../components/ui/unit';
import { describeError } from '../../../lib/api-client';
import { formatNumber } from '../../../lib/format';
import { useDeleteMode } from '../api/structures';
import { EditModeSection } from './edit-mode-section';
import { formatDampingRatio } from './mode-forms';
import { describeModeSource, directionLabels, sourceKindLabels } from './labels';

interface ModesTableProps {
  projectId: string;
  structureId: string;
  modes: SavedMode[];
  models: LumpedModel[] | undefined;
  canEdit: boolean;
  /** The modes that sign-offs rest on: approved ones are fixed, pending ones can change at the cost of the submission. */
  locks?: DesignLocks;
}

/**
 * The structure's design modes with where each came from; editors may change or remove one, except a mode an
 * approved design rests on.
 */
export function ModesTable({ projectId, structureId, modes, models, canEdit, locks = noLocks }: ModesTableProps) {
  const deleteMode = useDeleteMode(projectId, structureId);
  const [confirming, setConfirming] = useState<string | null>(null);
  const [editingId, setEditingId] = useState<string | null>(null);
  const [savedId, setSavedId] = useState<string | null>(null);
  const editing = modes.find((mode) => mode.id === editingId);
  if (modes.length === 0) {
    return <p className="text-small text-ink-muted">No modes yet.{canEdit ? ' Type one in, derive one from a beam or take one from a lumped model below.' : ''}</p>;
  }
  return (
    <div className="flex flex-col gap-3">
      {savedId && !editing ? <Notice tone="success" title={`Mode “${modes.find((mode) => mode.id === savedId)?.label ?? ''}” saved`} /> : null}
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
            <tr key={mode.id} className={mode.id === editingId ? 'bg-tide-50' : undefined}>
              <Td className="min-w-[6rem] font-semibold">{mode.label}</Td>
              <Td>{directionLabels[mode.direction]}</Td>
              <Td className="text-right tabular-nums">{formatNumber(mode.frequencyHz, 4)}</Td>
              <Td className="text-right tabular-nums">{formatNumber(mode.modalMassKg, 4)}</Td>
              <Td className="text-right tabular-nums">{formatDampingRatio(mode.dampingRatio)}</Td>
              <Td className="text-right tabular-nums">{mode.modeShapeMean === null ? '—' : formatNumber(mode.modeShapeMean, 3)}</Td>
              <Td className="min-w-[9rem]">
                <div className="flex flex-col items-start gap-1">
                  <Badge tone={mode.source.kind === 'typed' ? 'neutral' : 'tide'}>{sourceKindLabels[mode.source.kind]}</Badge>
                  <span className="text-caption text-ink-muted">{describeModeSource(mode.source, models)}</span>
                </div>
              </Td>
              {canEdit ? (
                <Td className="px-1! text-right">
                  {locks.approved.has(mode.id) ? (
                    <span className="inline-block w-[7rem] text-left text-caption text-ink-muted">Part of the approved design: fixed</span>
                  ) : (
                    <div className="flex flex-col items-end gap-1">
                      {confirming === mode.id || editingId === mode.id ? null : (
                        <Button
                          tone="quiet"
                          aria-label={`Edit mode ${mode.label}`}
                          onClick={() => {
                            setSavedId(null);
                            setEditingId(mode.id);
                          }}
                        >
                          Edit
                        </Button>
                      )}
                      <RemoveControl
                        label={`Remove mode ${mode.label}`}
                        confirming={confirming === mode.id}
                        busy={deleteMode.isPending}
                        onAsk={() => setConfirming(mode.id)}
                        onRemove={() => deleteMode.mutate(mode.id, { onSettled: () => setConfirming(null) })}
                        onKeep={() => setConfirming(null)}
                        className="flex flex-col items-end gap-1"
                      />
                    </div>
                  )}
                </Td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </Table>
      {/* A form already open stays open when an approved design comes to rest on its mode meanwhile, to show the refusal. */}
      {canEdit && editing ? (
        <EditModeSection
          key={editing.id}
          projectId={projectId}
          structureId={structureId}
          mode={editing}
          models={models}
          pendingSignOff={locks.pending.has(editing.id)}
          onSaved={() => {
            setSavedId(editing.id);
            setEditingId(null);
          }}
          onCancel={() => setEditingId(null)}
        />
      ) : null}
    </div>
  );
}
