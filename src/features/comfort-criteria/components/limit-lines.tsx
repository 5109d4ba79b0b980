import type { LimitLine } from './criteria-info';

/** The limits as sentences, each value not confirmed against its source marked "from memory". */
export function LimitLines({ lines }: { lines: LimitLine[] }) {
  return (
    <ul className="flex flex-col gap-1.5">
      {lines.map((line) => (
        <li key={line.text} className="flex flex-wrap items-baseline gap-2">
          <span>{line.text}</span>
          {line.fromMemory ? (
            <span
              className="rounded-pill bg-ember-100 px-2 py-0.5 text-caption font-semibold text-ember-700"
              title="This value could not be checked against the published source: confirm it before relying on a verdict."
            >
              from memory — not confirmed
            </span>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
