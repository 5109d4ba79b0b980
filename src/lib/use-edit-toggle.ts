import { useState } from 'react';

/**
 * A form opened from an Edit button and closed by saving or cancelling: `editing` while it is open, `saved` when the
 * last one closed by saving (for a notice), `start` for the button, `finish(didSave)` for the form's end.
 */
export function useEditToggle() {
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState(false);
  const start = () => {
    setSaved(false);
    setEditing(true);
  };
  const finish = (didSave: boolean) => {
    setEditing(false);
    setSaved(didSave);
  };
  return { editing, saved, start, finish };
}
