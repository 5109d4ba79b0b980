import { useEffect, useRef, useState } from 'react';
import type { LumpedModel, SavedMode } from '../../../../shared/contracts';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useReloadModes } from '../api/structures';
import { BeamModeForm, ModelModeForm, TypedModeForm } from './mode-forms';

interface EditModeSectionProps {
  projectId: string;
  structureId: string;
  mode: SavedMode;
  models: LumpedModel[] | undefined;
  /** A design waiting for the owner's sign-off rests on this mode. */
  pendingSignOff: boolean;
  onSaved: () => void;
  onCancel: () => void;
}

/** The form of the mode's own source, opened on the stored mode; a derived mode's numbers are not typed over. */
export function EditModeSection({ projectId, structureId, mode, models, pendingSignOff, onSaved, onCancel }: EditModeSectionProps) {
  const reloadModes = useReloadModes(projectId, structureId);
  // The form opens below the table: bring it into view (a long table may hide it).
  const sectionRef = useRef<HTMLElement>(null);
  useEffect(() => {
    // A block body: newer browsers answer scrollIntoView with a promise, which React would take for a clean-up.
    sectionRef.current?.scrollIntoView({ block: 'nearest' });
  }, []);
  // Bumped after a reload, so that the form opens again on the stored mode.
  const [opening, setOpening] = useState(0);
  const target = {
    projectId,
    structureId,
    mode,
    onDone: onSaved,
    onCancel,
    onReload: async () => {
      await reloadModes();
      setOpening((count) => count + 1);
    },
  };
  const key = `${mode.id}-${opening}`;
  const model = mode.source.kind === 'lumped-model' ? models?.find((entry) => entry.id === (mode.source as { modelId: string }).modelId) : undefined;

  return (
    <section ref={sectionRef} aria-label={`Editing mode ${mode.label}`} className="flex flex-col gap-4 rounded-plate border border-tide-200 bg-paper px-4 py-4">
      <h3 className="text-body font-semibold text-ink">Edit “{mode.label}”</h3>
      {mode.source.kind === 'beam' ? (
        <p className="text-small text-ink-soft">
          The frequency, modal mass and mean |φ| come from the beam: change the beam&apos;s numbers and they are derived again
          when you save.
        </p>
      ) : null}
      {mode.source.kind === 'lumped-model' ? (
        <Notice tone="info" title="Frequency and modal mass come from the lumped model">
          They cannot be typed over. To change them, change the model{model ? ` “${model.name}”` : ''} under Lumped models below:
          this mode follows it when the model is saved. Here you can take another mode of the model or another degree of
          freedom for the damper, and change the label, direction and damping ratio.
        </Notice>
      ) : null}
      {pendingSignOff ? (
        <Notice tone="caution" title="Waiting for the owner's sign-off">
          A design submitted to the owner rests on this mode. After a change the owner can no longer approve it as
          submitted: it will have to be returned and submitted again.
        </Notice>
      ) : null}
      {mode.source.kind === 'typed' ? <TypedModeForm key={key} {...target} /> : null}
      {mode.source.kind === 'beam' ? <BeamModeForm key={key} {...target} /> : null}
      {mode.source.kind === 'lumped-model' ? (
        model ? (
          <ModelModeForm key={key} model={model} {...target} />
        ) : (
          <div className="flex flex-col items-start gap-3">
            <p className="text-small text-ink-soft">The lumped model this mode is taken from could not be read, so the mode cannot be changed here just now.</p>
            <Button tone="quiet" onClick={onCancel}>
              Close
            </Button>
          </div>
        )
      ) : null}
    </section>
  );
}
