import type { ReactNode } from 'react';

type Tone = 'info' | 'caution' | 'error' | 'success';

const tones: Record<Tone, string> = {
  info: 'border-tide-200 bg-tide-50 text-tide-900',
  caution: 'border-ember-100 bg-ember-50 text-ember-700',
  error: 'border-signal-error/40 bg-signal-error-bg text-signal-error',
  success: 'border-signal-ok/30 bg-signal-ok-bg text-signal-ok',
};

interface NoticeProps {
  tone?: Tone;
  title?: string;
  children?: ReactNode;
  action?: ReactNode;
}

/** A boxed message. Errors are announced at once (role alert), the rest politely (role status). */
export function Notice({ tone = 'info', title, children, action }: NoticeProps) {
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={`flex flex-col gap-2 rounded-plate border-l-4 border px-4 py-3 text-small sm:flex-row sm:items-start sm:justify-between ${tones[tone]}`}
    >
      <div className="flex flex-col gap-1">
        {title ? <p className="font-semibold">{title}</p> : null}
        {children ? <div>{children}</div> : null}
      </div>
      {action ? <div className="shrink-0">{action}</div> : null}
    </div>
  );
}
