import { useState } from 'react';
import type { Structure } from '../../../../shared/contracts';
import { Button } from '../../../components/ui/button';
import { Detail } from '../../../components/ui/detail';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { describeError } from '../../../lib/api-client';
import { formatQuantity } from '../../../lib/format';
import { useEditToggle } from '../../../lib/use-edit-toggle';
import { useDeleteStructure } from '../api/structures';
import { structureKindLabels } from './labels';
import { EditStructureForm } from './structure-forms';

const notGiven = <span className="text-ink-muted">Not given</span>;

export function StructureDetails({ structure, canEdit, onDeleted }: { structure: Structure; canEdit: boolean; onDeleted: () => void }) {
  const { editing, saved, start: startEditing, finish: finishEditing } = useEditToggle();
  const [confirming, setConfirming] = useState(false);
  const deleteStructure = useDeleteStructure(structure.projectId, structure.id);
  return (
    <Panel
      title="Structure"
      actions={
        canEdit && !editing ? (
          <Button tone="secondary" onClick={startEditing}>
            Edit structure
          </Button>
        ) : undefined
      }
    >
      {saved && !editing ? (
        <div className="mb-4">
          <Notice tone="success" title="Structure saved" />
        </div>
      ) : null}
      {editing ? (
        <EditStructureForm
          structure={structure}
          onDone={finishEditing}
        />
      ) : (
        <div className="flex flex-col gap-5">
          <dl className="grid gap-x-8 gap-y-4 sm:grid-cols-3">
            <Detail term="Kind">{structureKindLabels[structure.kind]}</Detail>
            <Detail term="Span">{structure.spanM === null ? notGiven : formatQuantity(structure.spanM, 'm')}</Detail>
            <Detail term="Width">{structure.widthM === null ? notGiven : formatQuantity(structure.widthM, 'm')}</Detail>
            <Detail term="Deck area">{structure.deckAreaM2 === null ? notGiven : formatQuantity(structure.deckAreaM2, 'm²')}</Detail>
            <div className="sm:col-span-2">
              <Detail term="Notes">{structure.notes ? <span className="whitespace-pre-line">{structure.notes}</span> : notGiven}</Detail>
            </div>
          </dl>
          {canEdit ? (
            <div className="flex flex-col gap-2 border-t border-paper-line pt-4">
              {deleteStructure.isError ? (
                <Notice tone="error" title="The structure was not deleted">
                  {describeError(deleteStructure.error)}
                </Notice>
              ) : null}
              {confirming ? (
                <div className="flex flex-wrap items-center gap-3">
                  <p className="text-small font-medium text-signal-error">Delete “{structure.name}” with its modes and models?</p>
                  <Button tone="danger" busy={deleteStructure.isPending} onClick={() => deleteStructure.mutate(undefined, { onSuccess: onDeleted })}>
                    Yes, delete the structure
                  </Button>
                  <Button tone="quiet" onClick={() => setConfirming(false)}>
                    Keep it
                  </Button>
                </div>
              ) : (
                <div>
                  <Button tone="danger-outline" onClick={() => setConfirming(true)}>
                    Delete structure…
                  </Button>
                </div>
              )}
            </div>
          ) : null}
        </div>
      )}
    </Panel>
  );
}
