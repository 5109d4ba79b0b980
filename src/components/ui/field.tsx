import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

const control =
  'block w-full rounded-plate border border-paper-line bg-paper-raised px-3 py-2 text-body text-ink ' +
  'placeholder:text-ink-muted hover:border-ink-muted aria-[invalid=true]:border-signal-error aria-[invalid=true]:bg-signal-error-bg/40';

interface FieldFrameProps {
  id: string;
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  children: ReactNode;
}

/** A rule fragment such as "is required" reads as a sentence with the field's label in front of it. */
function errorSentence(label: string, error: string): string {
  return /^[a-z]/.test(error) ? `${label} ${error}` : error;
}

function FieldFrame({ id, label, hint, error, optional, children }: FieldFrameProps) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-small font-semibold text-ink-soft">
        {label}
        {optional ? <span className="ml-1 font-normal text-ink-muted">(optional)</span> : null}
      </label>
      {children}
      {hint ? (
        <p id={`${id}-hint`} className="text-caption text-ink-muted">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p id={`${id}-error`} className="text-caption font-medium text-signal-error">
          {errorSentence(label, error)}
        </p>
      ) : null}
    </div>
  );
}

interface CommonProps {
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
}

/** The id a control is labelled by and the accessibility attributes every control of a field carries. */
function useFieldControl(id: string | undefined, hint: ReactNode, error: string | undefined) {
  const autoId = useId();
  const fieldId = id ?? autoId;
  const described = [hint ? `${fieldId}-hint` : null, error ? `${fieldId}-error` : null].filter(Boolean).join(' ');
  return {
    fieldId,
    controlProps: {
      id: fieldId,
      'aria-invalid': error ? true : undefined,
      'aria-describedby': described || undefined,
    },
  };
}

export const TextField = forwardRef<HTMLInputElement, CommonProps & InputHTMLAttributes<HTMLInputElement>>(function TextField(
  { label, hint, error, optional, id, className = '', ...rest },
  ref,
) {
  const { fieldId, controlProps } = useFieldControl(id, hint, error);
  return (
    <FieldFrame id={fieldId} label={label} hint={hint} error={error} optional={optional}>
      <input ref={ref} {...controlProps} className={`${control} ${className}`} {...rest} />
    </FieldFrame>
  );
});

export const SelectField = forwardRef<HTMLSelectElement, CommonProps & SelectHTMLAttributes<HTMLSelectElement>>(function SelectField(
  { label, hint, error, optional, id, className = '', children, ...rest },
  ref,
) {
  const { fieldId, controlProps } = useFieldControl(id, hint, error);
  return (
    <FieldFrame id={fieldId} label={label} hint={hint} error={error} optional={optional}>
      <select ref={ref} {...controlProps} className={`${control} ${className}`} {...rest}>
        {children}
      </select>
    </FieldFrame>
  );
});

export const TextAreaField = forwardRef<HTMLTextAreaElement, CommonProps & TextareaHTMLAttributes<HTMLTextAreaElement>>(
  function TextAreaField({ label, hint, error, optional, id, className = '', ...rest }, ref) {
    const { fieldId, controlProps } = useFieldControl(id, hint, error);
    return (
      <FieldFrame id={fieldId} label={label} hint={hint} error={error} optional={optional}>
        <textarea ref={ref} rows={4} {...controlProps} className={`${control} ${className}`} {...rest} />
      </FieldFrame>
    );
  },
);
