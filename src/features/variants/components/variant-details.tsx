import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import type { ComfortCriteria, Variant } from '../../../../shared/contracts';
import { Button, LinkButton } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { Loading } from '../../../components/ui/loading';
import { Notice } from '../../../components/ui/notice';
import { Panel } from '../../../components/ui/panel';
import { QueryError } from '../../../components/ui/query-error';
import { describeError } from '../../../lib/api-client';
import { useDisplayUnits } from '../../../lib/display-units';
import { formatDateTime, formatNumber, formatPercent } from '../../../lib/format';
import { useSizeVariant, variantCurvesQueryOptions, type ModeChoice } from '../api/variants';
import { CurvesPanels } from './curves-panels';
import { frozenResultNotice } from './frozen-result';
import { describeTuning } from './labels';
import { DetuningSummary, Fact, HardwareFigures, LoadCaseVerdicts, ResultWarnings } from './result-panels';
import { VerdictTag } from './verdict-tag';

interface VariantDetailsProps {
  projectId: string;
  variant: Variant;
  mode: ModeChoice | undefined;
  criteria: ComfortCriteria | undefined;
  canEdit: boolean;
  onDelete?: () => void;
  deleting?: boolean;
}

/** A stored variant read in full: verdicts, detuning, curves, hardware numbers, warnings, and the smallest damper. */
export function VariantDetails({ projectId, variant, mode, criteria, canEdit, onDelete, deleting }: VariantDetailsProps) {
  const units = useDisplayUnits();
  const result = variant.result;
  return (
    <div className="flex flex-col gap-6">
      <header className="flex flex-col gap-3 border-b border-paper-line pb-5 sm:flex-row sm:items-end sm:justify-between">
        <div className="flex flex-col gap-1">
          <p className="text-caption font-semibold uppercase tracking-[0.12em] text-ember-600">Tuning variant</p>
          <h2 className="text-headline font-semibold text-ink">{variant.name}</h2>
          <p className="text-small text-ink-soft">
            {mode ? `${mode.structure.name} · ${mode.mode.label} (${formatNumber(mode.mode.frequencyHz, 4)} Hz)` : 'mode not found'} · {criteria?.name ?? 'criteria not found'}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          {result ? (
            <a
              className="px-2 text-small font-medium text-tide-800 underline underline-offset-4 hover:text-tide-900"
              href={`/api/projects/${projectId}/variants/${variant.id}/report.pdf`}
              download
            >
              Design report (PDF)
            </a>
          ) : null}
          {canEdit ? (
            <>
              <LinkButton tone="secondary" to={`/projects/${projectId}/tuning-variants/${variant.id}/edit`}>
                Edit variant
              </LinkButton>
              {onDelete ? (
                <Button tone="danger-outline" busy={deleting} onClick={onDelete}>
                  Delete
                </Button>
              ) : null}
            </>
          ) : null}
        </div>
      </header>

      {!result ? (
        <Notice tone="error" title="No result for the current inputs">
          {variant.resultError?.message ?? 'The engine gave no result.'}
        </Notice>
      ) : (
        <>
          <FrozenResultNotice result={result} />
          <Panel title="Damper">
            <dl className="grid gap-x-6 gap-y-3 text-small sm:grid-cols-2 lg:grid-cols-4">
              <Fact label="Mass ratio">{formatPercent(variant.massRatio, 3)}</Fact>
              <Fact label="Moving mass">
                {units.format('mass', result.tmd.massKg)} {variant.unitCount > 1 ? `in ${variant.unitCount} units` : ''}
              </Fact>
              <Fact label="Tuning">
                {formatNumber(result.tmd.frequencyHz, 4)} Hz, {describeTuning(variant.tuning)}
              </Fact>
              <Fact label="Damping ratio">{formatPercent(result.tmd.dampingRatio, 3)} of critical at {formatNumber(result.tmd.frequencyHz, 4)} Hz</Fact>
              <Fact label="Governing peak">
                <span className="font-semibold tabular-nums" data-testid="stored-governing-peak">
                  {units.format('acceleration', result.governing.peakAccelerationMPerS2, 4)}
                </span>
              </Fact>
              <Fact label="Governing">
                <span className="inline-flex items-center gap-2">
                  <VerdictTag verdict={result.governing.verdict} size="small" /> {Math.round(result.governing.utilisation * 100)} % of the limit
                </span>
              </Fact>
              <Fact label="Computed">{formatDateTime(result.computedAt)}</Fact>
            </dl>
          </Panel>
          <Panel title="Verdict per load case" description="Peak accelerations over the loaded band, with and without the damper, against the comfort criteria.">
            <LoadCaseVerdicts result={result} />
          </Panel>
          <Panel title="Detuning" description="The damper held at its tuning while the structure's frequency moves within the band.">
            <DetuningSummary result={result} />
          </Panel>
          <VariantCurvesPanel projectId={projectId} variant={variant} mode={mode} />
          <Panel title="Hardware numbers" description="For the fabricator's hardware sheet; every damping ratio names the frequency it is referred to.">
            <HardwareFigures result={result} />
          </Panel>
          <ResultWarnings result={result} />
          {canEdit && 'method' in variant.tuning ? <SmallestDamper projectId={projectId} variant={variant} /> : null}
        </>
      )}
      <Caution />
    </div>
  );
}

function FrozenResultNotice({ result }: { result: Variant['result'] }) {
  const notice = frozenResultNotice(result);
  return notice ? (
    <Notice tone="caution" title={notice.title}>
      {notice.body}
    </Notice>
  ) : null;
}

function VariantCurvesPanel({ projectId, variant, mode }: { projectId: string; variant: Variant; mode: ModeChoice | undefined }) {
  const result = variant.result;
  const [loadCaseId, setLoadCaseId] = useState(variant.result?.governing.loadCaseId ?? variant.loadCaseIds[0]);
  const curves = useQuery(variantCurvesQueryOptions(projectId, variant.id, loadCaseId));
  if (!result) return null;
  return (
    <Panel title="Curves">
      {result.loadCases.length > 1 ? (
        <div role="tablist" aria-label="Load case plotted" className="mb-4 flex flex-wrap gap-1 border-b border-paper-line">
          {result.loadCases.map((lc) => (
            <button
              key={lc.loadCaseId}
              type="button"
              role="tab"
              aria-selected={lc.loadCaseId === loadCaseId}
              onClick={() => setLoadCaseId(lc.loadCaseId)}
              className={`-mb-px border-b-2 px-3 py-1.5 text-small font-semibold ${
                lc.loadCaseId === loadCaseId ? 'border-tide-700 text-ink' : 'border-transparent text-ink-muted hover:text-ink'
              }`}
            >
              {lc.name}
            </button>
          ))}
        </div>
      ) : null}
      {curves.isPending ? (
        <Loading label="Computing the curves on the server…" />
      ) : curves.isError ? (
        <QueryError error={curves.error} retry={() => void curves.refetch()} what="the curves" />
      ) : (
        <CurvesPanels
          curves={curves.data}
          strokeLimitM={variant.hardware.strokeLimitM ?? null}
          structureFrequencyToleranceRatio={variant.structureFrequencyToleranceRatio}
          tmdDampingToleranceRatio={variant.tmdDampingToleranceRatio}
          structureFrequencyHz={mode?.mode.frequencyHz ?? result.detuning.structureFrequencyRangeHz[0] / (1 - variant.structureFrequencyToleranceRatio)}
        />
      )}
    </Panel>
  );
}

/** The smallest mass ratio, tuned by the variant's method, meeting the criteria on every load case over the detuning band. */
function SmallestDamper({ projectId, variant }: { projectId: string; variant: Variant }) {
  const units = useDisplayUnits();
  const size = useSizeVariant(projectId, variant);
  const answer = size.data;
  return (
    <Panel
      title="Smallest damper"
      description="The least mass ratio, tuned by this variant's method, that meets the criteria on every load case over the whole detuning band."
      actions={
        <Button tone="secondary" busy={size.isPending && size.variables === false} onClick={() => size.mutate(false)}>
          Find the smallest damper
        </Button>
      }
    >
      {size.isPending ? <Loading label="Searching mass ratios (each trial checks every load case over the detuning band)…" /> : null}
      {size.isError ? (
        <Notice tone="error" title="No size found">
          {describeError(size.error)}
        </Notice>
      ) : null}
      {answer && !size.isPending ? (
        <div className="flex flex-col gap-3">
          <dl className="grid gap-x-6 gap-y-3 text-small sm:grid-cols-2 lg:grid-cols-4">
            <Fact label="Smallest mass ratio">
              <span className="text-lead font-semibold" data-testid="smallest-mass-ratio">
                {formatPercent(answer.massRatio, 3)}
              </span>
            </Fact>
            <Fact label="Moving mass">{answer.tmd ? units.format('mass', answer.tmd.massKg) : 'no damper needed'}</Fact>
            <Fact label="Worst over the band">
              {units.format('acceleration', answer.worstPeakAccelerationMPerS2, 3)} ({Math.round(answer.worstUtilisation * 100)} %)
            </Fact>
            <Fact label="Trials">{answer.evaluations}</Fact>
          </dl>
          {answer.applied ? (
            <Notice tone="success" title="Applied">
              The variant now has this mass ratio; its result was computed again.
            </Notice>
          ) : answer.tmd ? (
            <div>
              <Button busy={size.isPending} onClick={() => size.mutate(true)}>
                Apply {formatPercent(answer.massRatio, 3)} to this variant
              </Button>
            </div>
          ) : null}
        </div>
      ) : null}
    </Panel>
  );
}
