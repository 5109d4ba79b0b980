import type { SignOffStatus } from '../../../../shared/contracts/sign-offs';

const labels: Record<SignOffStatus, string> = { submitted: 'awaiting decision', approved: 'approved', returned: 'returned' };

const tones: Record<SignOffStatus, string> = {
  submitted: 'border-paper-line bg-paper-sunk text-ink-soft',
  approved: 'border-tide-200 bg-tide-50 text-tide-800',
  returned: 'border-ember-500/60 bg-ember-50 text-ember-700',
};

/**
 * A sign-off's status in words and a shape, never by colour alone: an open circle while it awaits the owner, a tick in
 * a filled circle once approved, a bent arrow back once returned.
 */
export function SignOffStatusTag({ status }: { status: SignOffStatus }) {
  return (
    <span
      data-testid="sign-off-status"
      className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-plate border px-2 py-0.5 text-small font-semibold ${tones[status]}`}
    >
      <svg aria-hidden="true" viewBox="0 0 12 12" className="size-3">
        {status === 'submitted' ? (
          <circle cx="6" cy="6" r="4.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
        ) : status === 'approved' ? (
          <>
            <circle cx="6" cy="6" r="5.5" fill="currentColor" />
            <path d="M3.3 6.2 5.2 8 8.8 4.2" fill="none" stroke="white" strokeWidth="1.5" />
          </>
        ) : (
          <path d="M10 10V6.5A2.5 2.5 0 0 0 7.5 4H2.5M4.5 1.8 2.3 4l2.2 2.2" fill="none" stroke="currentColor" strokeWidth="1.5" />
        )}
      </svg>
      {labels[status]}
    </span>
  );
}
