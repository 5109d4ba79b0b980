import { Button } from './button';

interface RemoveControlProps {
  /** The accessible name of the first button (“Remove load case Crowd”). */
  label: string;
  /** True once the first button was pressed: Remove and Keep show in its place. */
  confirming: boolean;
  busy: boolean;
  onAsk: () => void;
  onRemove: () => void;
  onKeep: () => void;
  /** The classes of the Remove/Keep pair. */
  className?: string;
}

/** Remove… that asks once more: Remove goes ahead, Keep goes back. */
export function RemoveControl({ label, confirming, busy, onAsk, onRemove, onKeep, className = 'flex gap-2' }: RemoveControlProps) {
  return confirming ? (
    <span className={className}>
      <Button tone="danger" busy={busy} onClick={onRemove}>
        Remove
      </Button>
      <Button tone="quiet" onClick={onKeep}>
        Keep
      </Button>
    </span>
  ) : (
    <Button tone="quiet" aria-label={label} onClick={onAsk}>
      Remove…
    </Button>
  );
}
