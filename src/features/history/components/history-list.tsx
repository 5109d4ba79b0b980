import type { HistoryEvent } from '../../../../shared/contracts/history';
import { formatDateTime } from '../../../lib/format';
import { actorName, eventLines, eventSentence, type ChangeLine } from './describe-event';

const actionMarks: Record<string, string> = {
  create: 'border-tide-600',
  update: 'border-ink-muted',
  delete: 'border-signal-error',
  submitted: 'border-ember-600',
  approved: 'border-signal-ok',
  returned: 'border-ember-600',
};

function Line({ line }: { line: ChangeLine }) {
  if (line.hiddenValue) {
    return (
      <li>
        <span className="font-medium text-ink-soft">{line.what}</span>: changed <span className="text-ink-muted">(too large to keep in the history)</span>
      </li>
    );
  }
  return (
    <li>
      <span className="font-medium text-ink-soft">{line.what}</span>
      {': '}
      {line.before !== undefined && line.after !== undefined ? (
        <>
          <span className="text-ink-muted line-through decoration-ink-muted/60">{line.before}</span>
          <span aria-hidden="true"> → </span>
          <span className="sr-only"> became </span>
          <span className="text-ink">{line.after}</span>
        </>
      ) : (
        <span className="text-ink">{line.after ?? line.before}</span>
      )}
    </li>
  );
}

/** One entry: who did what to which thing, when, and each value before and after. */
function HistoryEntry({ event, names }: { event: HistoryEvent; names: Record<string, string> }) {
  const lines = eventLines(event, names);
  const atCreateOrDelete = event.action === 'create' || event.action === 'delete' || event.action === 'submitted';
  return (
    <li className={`flex flex-col gap-1 border-l-4 py-2 pl-4 ${actionMarks[event.action] ?? 'border-paper-line'}`} data-history-entry={event.id}>
      <p className="text-body text-ink">
        <span className="font-semibold">{actorName(event)}</span> {eventSentence(event)}
      </p>
      <p className="text-caption text-ink-muted">
        <time dateTime={event.at}>{formatDateTime(event.at)}</time>
      </p>
      {lines.length === 0 ? null : atCreateOrDelete ? (
        <details className="text-small">
          <summary className="cursor-pointer text-tide-800">{event.action === 'delete' ? 'Values when deleted' : 'Values at the time'}</summary>
          <ul className="mt-1 flex flex-col gap-0.5 pl-4">
            {lines.map((line, i) => (
              <Line key={i} line={line} />
            ))}
          </ul>
        </details>
      ) : (
        <ul className="flex flex-col gap-0.5 text-small">
          {lines.map((line, i) => (
            <Line key={i} line={line} />
          ))}
        </ul>
      )}
    </li>
  );
}

export function HistoryList({ events, names }: { events: readonly HistoryEvent[]; names: Record<string, string> }) {
  return (
    <ol className="flex flex-col gap-3" aria-label="Changes, newest first">
      {events.map((event) => (
        <HistoryEntry key={event.id} event={event} names={names} />
      ))}
    </ol>
  );
}
