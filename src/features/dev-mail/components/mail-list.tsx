import { Fragment } from 'react';
import type { DevMail } from '../../../../shared/contracts';
import { formatDateTime } from '../../../lib/format';

const urlPattern = /(https?:\/\/[^\s<>"]+)/g;

/** Mail text with its web addresses made into links (same-site links open here, others in a new tab). */
function LinkedText({ text }: { text: string }) {
  const parts = text.split(urlPattern);
  return (
    <>
      {parts.map((part, index) => {
        if (index % 2 === 0) return <Fragment key={index}>{part}</Fragment>;
        const sameSite = part.startsWith(window.location.origin);
        return (
          <a
            key={index}
            href={part}
            className="break-all font-medium text-tide-800 underline underline-offset-4 hover:text-tide-900"
            {...(sameSite ? {} : { target: '_blank', rel: 'noreferrer' })}
          >
            {part}
          </a>
        );
      })}
    </>
  );
}

export function MailList({ mails }: { mails: DevMail[] }) {
  if (mails.length === 0) {
    return <p className="text-small text-ink-muted">No mail has been caught yet. Mail sent by the server (such as invitations) appears here.</p>;
  }
  return (
    <ol aria-label="Caught mails" className="flex flex-col gap-4">
      {mails.map((mail) => (
        <li key={mail.id}>
          <article aria-label={mail.subject} className="rounded-plate border border-paper-line bg-paper-raised p-5">
            <header className="flex flex-col gap-1 border-b border-paper-line pb-3 sm:flex-row sm:items-baseline sm:justify-between">
              <h2 className="text-lead font-semibold text-ink">{mail.subject || '(no subject)'}</h2>
              <time dateTime={mail.receivedAt} className="text-caption text-ink-muted">
                {formatDateTime(mail.receivedAt)}
              </time>
            </header>
            <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-small">
              <dt className="font-semibold text-ink-muted">From</dt>
              <dd className="text-ink-soft">{mail.from}</dd>
              <dt className="font-semibold text-ink-muted">To</dt>
              <dd className="text-ink-soft">{mail.to.join(', ')}</dd>
            </dl>
            <pre className="mt-4 whitespace-pre-wrap font-sans text-small text-ink">
              <LinkedText text={mail.text} />
            </pre>
          </article>
        </li>
      ))}
    </ol>
  );
}
