import { formatNumber } from '../../../lib/format';
import type { LoadCaseInfo } from './load-case-info';

/** The source a load case follows, the frequencies it covers and its values from memory. */
export function LoadCaseInfoBox({ info, title }: { info: LoadCaseInfo; title?: string }) {
  return (
    <section aria-label={title ?? 'Source'} className="flex flex-col gap-2 rounded-plate border border-tide-200 bg-tide-50 px-4 py-3 text-small text-tide-900">
      {title ? <p className="font-semibold">{title}</p> : null}
      {info.problem ? (
        <p className="text-signal-error">{info.problem}</p>
      ) : (
        <>
          <p>
            <span className="font-semibold">Source: </span>
            {info.source}
          </p>
          {info.rangeHz ? (
            <p>
              <span className="font-semibold">Covers: </span>
              {info.direction === 'lateral' ? 'lateral' : 'vertical'} modes of {formatNumber(info.rangeHz[0], 3)}–{formatNumber(info.rangeHz[1], 3)} Hz
              {info.direction === 'lateral' ? '' : ' (torsional modes through their vertical ordinates)'}; outside that range the case does not load the mode and a
              warning says so.
            </p>
          ) : null}
          {info.cautions.length ? (
            <div className="rounded-plate border border-ember-100 bg-ember-50 px-3 py-2 text-ember-700">
              <p className="font-semibold">From memory — not confirmed against the published source</p>
              <ul className="mt-1 list-disc pl-5">
                {info.cautions.map((caution) => (
                  <li key={caution}>{caution}</li>
                ))}
              </ul>
            </div>
          ) : null}
        </>
      )}
    </section>
  );
}
