import { useState } from 'react';
import type { LumpedModel } from '../../../../shared/contracts';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { describeError } from '../../../lib/api-client';
import { formatDateTime } from '../../../lib/format';
import { useDeleteLumpedModel } from '../api/structures';
import { LumpedModelEditor, LumpedModelView } from './lumped-model-editor';
import { ModelModeForm } from './mode-forms';

interface StructureModelsProps {
  projectId: string;
  structureId: string;
  models: LumpedModel[];
  canEdit: boolean;
}

/** The structure's lumped models: pick one to see or change it, or start a new one; take a design mode from it. */
export function StructureModels({ projectId, structureId, models, canEdit }: StructureModelsProps) {
  const [selectedId, setSelectedId] = useState<string | 'new' | null>(() => models[0]?.id ?? (canEdit ? 'new' : null));
  const [saved, setSaved] = useState(false);
  const [modeAdded, setModeAdded] = useState(false);
  const deleteModel = useDeleteLumpedModel(projectId, structureId);
  const [confirmingDelete, setConfirmingDelete] = useState(false);
  const selected = models.find((model) => model.id === selectedId);
  const choose = (id: string | 'new') => {
    setSelectedId(id);
    setSaved(false);
    setModeAdded(false);
    setConfirmingDelete(false);
  };

  return (
    <Panel
      title="Lumped models"
      description="An n-DOF model of masses and springs — the structure alone, or with dampers — whose modes are computed as you type. A mode of a saved model can become a design mode."
    >
      <div className="flex flex-col gap-5">
        <div role="group" aria-label="Choose a model" className="flex flex-wrap gap-2">
          {models.map((model) => (
            <Button key={model.id} tone={model.id === selectedId ? 'primary' : 'secondary'} aria-pressed={model.id === selectedId} onClick={() => choose(model.id)}>
              {model.name}
            </Button>
          ))}
          {canEdit ? (
            <Button tone={selectedId === 'new' ? 'primary' : 'secondary'} aria-pressed={selectedId === 'new'} onClick={() => choose('new')}>
              New model
            </Button>
          ) : null}
        </div>
        {models.length === 0 && !canEdit ? <p className="text-small text-ink-muted">No lumped models yet.</p> : null}
        {saved ? <Notice tone="success" title="Model saved" /> : null}

        {selectedId === 'new' && canEdit ? (
          <LumpedModelEditor
            key="new"
            projectId={projectId}
            structureId={structureId}
            onSaved={(model) => {
              setSelectedId(model.id);
              setSaved(true);
            }}
          />
        ) : null}

        {selected ? (
          <div className="flex flex-col gap-6">
            <p className="text-caption text-ink-muted">
              Saved {formatDateTime(selected.updatedAt)} (revision {selected.version}).
            </p>
            {canEdit ? (
              <LumpedModelEditor
                key={`${selected.id}-${selected.version}`}
                projectId={projectId}
                structureId={structureId}
                model={selected}
                onSaving={() => setSaved(false)}
                onSaved={() => setSaved(true)}
              />
            ) : (
              <LumpedModelView model={selected} />
            )}
            {canEdit ? (
              <section aria-label="Use a mode of this model" className="flex flex-col gap-3 rounded-plate border border-paper-line bg-paper px-4 py-4">
                <h3 className="text-body font-semibold text-ink">Use a mode of “{selected.name}” as a design mode</h3>
                <p className="text-small text-ink-soft">
                  Takes the saved model&apos;s mode at the degree of freedom where the damper would sit; the server derives its
                  frequency and modal mass, and re-derives them when the model changes.
                </p>
                {modeAdded ? <Notice tone="success" title="Design mode added to the modes table above" /> : null}
                <ModelModeForm key={`${selected.id}-${selected.version}`} projectId={projectId} structureId={structureId} model={selected} onDone={() => setModeAdded(true)} />
              </section>
            ) : null}
            {canEdit ? (
              <div className="flex flex-col gap-2">
                {deleteModel.isError ? (
                  <Notice tone="error" title="The model was not deleted">
                    {describeError(deleteModel.error)}
                  </Notice>
                ) : null}
                {confirmingDelete ? (
                  <div className="flex flex-wrap items-center gap-3">
                    <p className="text-small font-medium text-signal-error">Delete the model “{selected.name}”?</p>
                    <Button
                      tone="danger"
                      busy={deleteModel.isPending}
                      onClick={() => deleteModel.mutate(selected.id, { onSuccess: () => choose(models.find((model) => model.id !== selected.id)?.id ?? 'new') })}
                    >
                      Yes, delete the model
                    </Button>
                    <Button tone="quiet" onClick={() => setConfirmingDelete(false)}>
                      Keep it
                    </Button>
                  </div>
                ) : (
                  <div>
                    <Button tone="danger-outline" onClick={() => setConfirmingDelete(true)}>
                      Delete model…
                    </Button>
                  </div>
                )}
              </div>
            ) : null}
          </div>
        ) : null}
      </div>
    </Panel>
  );
}
