import type { ReactNode } from 'react';
import type { SignOff } from '../../../../shared/contracts/sign-offs';
import { Caution } from '../../../components/ui/caution';
import { Notice } from '../../../components/ui/notice';
import { HardwareSheetPanel } from './hardware-sheet-panel';

/**
 * The hardware sheets of a project: one per approved design, newest first, each with its caution; while no design is
 * approved yet, what waits for the owner and the caution all the same. `afterSheet` places what the page adds under
 * each sheet (its as-built records).
 */
export function HardwareSheetList({
  projectId,
  signOffs,
  afterSheet,
}: {
  projectId: string;
  signOffs: SignOff[];
  afterSheet?: (entry: SignOff) => ReactNode;
}) {
  const approved = signOffs.filter((entry) => entry.status === 'approved');
  const waiting = signOffs.filter((entry) => entry.status === 'submitted');
  return (
    <div className="flex flex-col gap-6">
      {approved.length === 0 ? (
        <Notice tone="info" title="No hardware sheet yet">
          A hardware sheet exists once the owner approves a design on the Sign-off page; it is read from that approval and never
          changes afterwards.
          {waiting.length > 0
            ? ` Waiting for the owner's decision: ${waiting.map((entry) => entry.snapshot.variant.name).join(', ')}.`
            : ' No design waits for a decision now.'}
        </Notice>
      ) : (
        approved.map((entry) => (
          <div key={entry.id} className="flex flex-col gap-6">
            <HardwareSheetPanel projectId={projectId} signOffId={entry.id} />
            {afterSheet ? afterSheet(entry) : null}
          </div>
        ))
      )}
      {/* Each sheet carries its own caution; without one the page still says it. */}
      {approved.length === 0 ? <Caution /> : null}
    </div>
  );
}
