import { useQuery } from '@tanstack/react-query';
import type { SignOff } from '../../../../shared/contracts/sign-offs';
import { asBuiltDesignOf, type AsBuiltDesign } from '../../../../shared/compute/as-built';
import { Caution } from '../../../components/ui/caution';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { QueryError } from '../../../components/ui/query-error';
import { formatDateTime, formatNumber } from '../../../lib/format';
import { asBuiltQueryOptions } from '../api/as-built';
import { AsBuiltComparisonView } from './as-built-comparison';
import { AsBuiltForm } from './as-built-form';

function designOf(signOff: SignOff): AsBuiltDesign | null {
  try {
    return asBuiltDesignOf(signOff.snapshot);
  } catch {
    return null;
  }
}

const who = (record: { recordedByName: string | null }) => record.recordedByName || 'a former member';

/**
 * "As built" of one approved design: the fabricator's record of each unit's measured moving mass, spring rate and
 * tuned frequency, compared with the hardware sheet (the newest record in full, the earlier ones below it). Owners and
 * viewers read it; the fabricator, engineers and admins record.
 */
export function AsBuiltSection({ projectId, signOff, canRecord }: { projectId: string; signOff: SignOff; canRecord: boolean }) {
  const records = useQuery(asBuiltQueryOptions(projectId, signOff.id));
  const design = designOf(signOff);
  const title = `As built · ${signOff.snapshot.variant.name}`;
  if (!design) {
    return (
      <Panel title={title}>
        <Notice tone="caution" title="No hardware numbers">
          The approved result holds no hardware entry, so there is nothing to compare as-built values with.
        </Notice>
      </Panel>
    );
  }
  const [latest, ...earlier] = records.data ?? [];
  return (
    <Panel
      title={title}
      description={`What was built, unit by unit, against the hardware sheet: ${design.unitCount} unit${design.unitCount === 1 ? '' : 's'}, tuning range ${formatNumber(design.frequencyLowHz, 3)}–${formatNumber(design.frequencyHighHz, 3)} Hz.`}
    >
      <div className="flex flex-col gap-6">
        <Caution>
          As-built values are compared with the approved hardware sheet only; a unit outside the tuning range is for the
          engineer of record to judge before the damper is accepted.
        </Caution>
        {records.isPending ? <Loading label="Loading the as-built records…" /> : null}
        {records.isError ? <QueryError error={records.error} retry={() => void records.refetch()} what="the as-built records" /> : null}
        {canRecord ? (
          records.isSuccess ? (
            <section aria-label="New as-built record" className="flex flex-col gap-3">
              <h3 className="text-body font-semibold text-ink">New record</h3>
              <p className="text-small text-ink-muted">
                One row per unit. The moving mass is needed for each; the spring rate and the tuned frequency when they were measured.
                {latest ? ' The rows start from the latest record.' : ''}
              </p>
              <AsBuiltForm projectId={projectId} signOffId={signOff.id} design={design} latest={latest?.units} />
            </section>
          ) : null
        ) : (
          <p className="text-small text-ink-soft">
            You read the as-built records here; the fabricator, an engineer or an admin records them.
          </p>
        )}
        {records.isSuccess ? (
          latest ? (
            <section aria-label="Latest as-built record" className="flex flex-col gap-3">
              <h3 className="text-body font-semibold text-ink">
                Latest record <span className="font-normal text-ink-muted">· {formatDateTime(latest.recordedAt)} by {who(latest)}</span>
              </h3>
              {latest.note ? <p className="text-small text-ink-soft">{latest.note}</p> : null}
              <AsBuiltComparisonView comparison={latest.comparison} caption={`As-built record of ${formatDateTime(latest.recordedAt)} against the hardware sheet`} />
            </section>
          ) : (
            <p className="text-small text-ink-muted">No as-built record yet.</p>
          )
        ) : null}
        {earlier.length > 0 ? (
          <section aria-label="Earlier as-built records" className="flex flex-col gap-2">
            <h3 className="text-body font-semibold text-ink">Earlier records ({earlier.length})</h3>
            <ul className="flex flex-col gap-2">
              {earlier.map((record) => {
                const outside = record.comparison.unitsOutsideRange;
                return (
                  <li key={record.id}>
                    <details className="rounded-plate border border-paper-line bg-paper px-4 py-2">
                      <summary className="cursor-pointer text-small text-ink">
                        <span className="font-semibold">{formatDateTime(record.recordedAt)}</span> by {who(record)} · {record.units.length} unit
                        {record.units.length === 1 ? '' : 's'} ·{' '}
                        {outside.length > 0 ? (
                          <span className="font-semibold text-signal-error">
                            <span aria-hidden="true">⚠ </span>outside the range: unit{outside.length === 1 ? '' : 's'} {outside.join(', ')}
                          </span>
                        ) : (
                          <span className="text-signal-ok">
                            <span aria-hidden="true">✓ </span>all in range
                          </span>
                        )}
                        {record.note ? <span className="text-ink-muted"> · {record.note}</span> : null}
                      </summary>
                      <div className="mt-3">
                        <AsBuiltComparisonView comparison={record.comparison} caption={`As-built record of ${formatDateTime(record.recordedAt)} against the hardware sheet`} />
                      </div>
                    </details>
                  </li>
                );
              })}
            </ul>
          </section>
        ) : null}
      </div>
    </Panel>
  );
}
