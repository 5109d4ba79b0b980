import { useState } from 'react';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { BeamModeForm, TypedModeForm } from './mode-forms';

type Way = 'typed' | 'beam';

/** Editors add a design mode typed in or derived from a beam (a lumped model's mode is taken from the model below). */
export function AddModePanel({ projectId, structureId }: { projectId: string; structureId: string }) {
  const [way, setWay] = useState<Way>('typed');
  const [added, setAdded] = useState(false);
  const onAdded = () => setAdded(true);
  return (
    <Panel title="Add a mode" description="Type a mode in from a finite-element model, or derive one from a uniform beam when there is no model yet.">
      <div className="flex flex-col gap-5">
        <div role="tablist" aria-label="How to add the mode" className="flex gap-1 border-b border-paper-line">
          {(
            [
              ['typed', 'Type in'],
              ['beam', 'From a beam'],
            ] as const
          ).map(([value, label]) => (
            <button
              key={value}
              type="button"
              role="tab"
              aria-selected={way === value}
              className={`-mb-px border-b-2 px-4 py-2 text-small font-semibold ${way === value ? 'border-tide-700 text-tide-800' : 'border-transparent text-ink-muted hover:text-ink'}`}
              onClick={() => {
                setWay(value);
                setAdded(false);
              }}
            >
              {label}
            </button>
          ))}
        </div>
        {added ? <Notice tone="success" title="Mode added to the table above" /> : null}
        <div role="tabpanel" aria-label={way === 'typed' ? 'Type in' : 'From a beam'}>
          {way === 'typed' ? (
            <TypedModeForm projectId={projectId} structureId={structureId} onDone={onAdded} />
          ) : (
            <BeamModeForm projectId={projectId} structureId={structureId} onDone={onAdded} />
          )}
        </div>
      </div>
    </Panel>
  );
}
