import { useState } from 'react';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import type { SaveRefusal } from './changes';

interface SaveRefusalNoticeProps {
  refusal: SaveRefusal | null;
  /** What was being changed, for the button (“mode”, “load case”). */
  what: string;
  /** Fetches the stored thing again and opens the form on it. */
  onReload: () => Promise<unknown>;
}

/** Why a save was refused: changed by someone else (with a reload), or part of an approved design (the server's words). */
export function SaveRefusalNotice({ refusal, what, onReload }: SaveRefusalNoticeProps) {
  const [reloading, setReloading] = useState(false);
  if (!refusal) return null;
  if (refusal.kind === 'frozen') {
    return (
      <Notice tone="error" title="Not saved: an approved design rests on this">
        {/[.!?]$/.test(refusal.message) ? refusal.message : `${refusal.message}.`}
      </Notice>
    );
  }
  return (
    <Notice
      tone="caution"
      title="Someone changed this meanwhile"
      action={
        <Button
          tone="secondary"
          busy={reloading}
          onClick={() => {
            setReloading(true);
            void onReload().finally(() => setReloading(false));
          }}
        >
          Reload {what}
        </Button>
      }
    >
      Your change was not saved. Reload and apply your change again: the form then shows what is stored now, and what
      you typed here is replaced.
    </Notice>
  );
}
