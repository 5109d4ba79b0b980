import { useState, type ReactNode } from 'react';
import type { SignOff } from '../../../../shared/contracts/sign-offs';
import { formatDateTime } from '../../../lib/format';
import { SignOffDecision } from './sign-off-decision';
import { SignOffStatusTag } from './sign-off-status';

const mailStateWords = { pending: 'waiting to be sent', sent: 'sent', failed: 'not delivered (retried)' } as const;

interface SignOffTimelineProps {
  signOffs: SignOff[];
  /** A person's name from their id; the id's owner may have left the project. */
  personName: (userId: string | null) => string;
  projectId: string;
  /** The comfort criteria of a sign-off's snapshot in words, for reading a decided design again. */
  criteriaInWords: (signOff: SignOff) => ReactNode;
}

/** The project's sign-offs, newest first: what was submitted, by whom, and what the owner decided. */
export function SignOffTimeline({ signOffs, personName, projectId, criteriaInWords }: SignOffTimelineProps) {
  const [openId, setOpenId] = useState<string | null>(null);
  if (signOffs.length === 0) return <p className="text-small text-ink-muted">Nothing has been submitted for sign-off yet.</p>;
  return (
    <ol className="flex flex-col divide-y divide-paper-line" aria-label="Sign-off timeline">
      {signOffs.map((signOff) => (
        <li key={signOff.id} className="flex flex-col gap-2 py-3" data-testid="sign-off-entry">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <span className="font-semibold text-tide-800">{signOff.snapshot.variant.name}</span>
            <SignOffStatusTag status={signOff.status} />
          </div>
          <p className="text-small text-ink-soft">
            Submitted by {personName(signOff.submittedBy)} on {formatDateTime(signOff.submittedAt)}
            {signOff.message ? <>: “{signOff.message}”</> : null}
          </p>
          {signOff.decidedAt ? (
            <p className="text-small text-ink-soft">
              {signOff.status === 'approved' ? 'Approved' : 'Returned'} by {signOff.decidedByName ?? personName(signOff.decidedBy)} on {formatDateTime(signOff.decidedAt)}
              {signOff.decisionComment ? <>: “{signOff.decisionComment}”</> : null}
            </p>
          ) : null}
          {signOff.mails.length > 0 ? (
            <p className="text-caption text-ink-muted">
              Mails:{' '}
              {signOff.mails.map((mail, i) => (
                <span key={`${mail.to}-${i}`}>
                  {i > 0 ? '; ' : ''}
                  to {mail.to} — {mailStateWords[mail.state]}
                  {mail.attempts > 1 ? ` after ${mail.attempts} attempts` : ''}
                </span>
              ))}
            </p>
          ) : (
            <p className="text-caption text-ink-muted">Mails: none.</p>
          )}
          {signOff.status === 'submitted' ? null : (
            <div>
              <button
                type="button"
                className="text-small font-medium text-tide-800 underline-offset-4 hover:underline"
                aria-expanded={openId === signOff.id}
                onClick={() => setOpenId(openId === signOff.id ? null : signOff.id)}
              >
                {openId === signOff.id ? 'Hide the design as submitted' : 'Read the design as submitted'}
              </button>
            </div>
          )}
          {openId === signOff.id ? (
            <SignOffDecision projectId={projectId} signOff={signOff} canDecide={false} personName={personName} criteriaInWords={criteriaInWords(signOff)} />
          ) : null}
        </li>
      ))}
    </ol>
  );
}
