import { Button } from './button';
import { Notice } from './notice';

/** The error of a form the server refused, under the given title; nothing when there is none. */
export function FormErrorNotice({ title, error }: { title: string; error: string | null }) {
  return error ? (
    <Notice tone="error" title={title}>
      {error}
    </Notice>
  ) : null;
}

/** A form's submit button and its Cancel. */
export function FormActions({ submitLabel, busy, disabled, onCancel }: { submitLabel: string; busy: boolean; disabled?: boolean; onCancel: () => void }) {
  return (
    <div className="flex flex-wrap gap-3">
      <Button type="submit" busy={busy} disabled={disabled}>
        {submitLabel}
      </Button>
      <Button tone="quiet" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}
