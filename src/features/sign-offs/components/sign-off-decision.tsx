import { zodResolver } from '@hookform/resolvers/zod';
import { useState, type ReactNode } from 'react';
import { useForm } from 'react-hook-form';
import {
  approveSignOffSchema,
  returnSignOffSchema,
  type ApproveSignOffInput,
  type ReturnSignOffInput,
  type SignOff,
} from '../../../../shared/contracts/sign-offs';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { TextAreaField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { Table, Td, Th } from '../../../components/ui/table';
import { describeError, issueMessage, issuesFor, isApiError } from '../../../lib/api-client';
import { formatDateTime, formatPercent, formatQuantity } from '../../../lib/format';
import { useDecideSignOff } from '../api/sign-offs';
import { decisionSummary } from './decision-summary';
import { SignOffStatusTag } from './sign-off-status';

interface SignOffDecisionProps {
  projectId: string;
  signOff: SignOff;
  /** Only an owner approves or returns; everyone else reads. */
  canDecide: boolean;
  personName: (userId: string | null) => string;
  /** The comfort criteria of the snapshot in words (the route composes them from the criteria's own feature). */
  criteriaInWords: ReactNode;
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="flex flex-col">
      <dt className="text-caption font-semibold text-ink-muted">{label}</dt>
      <dd className="tabular-nums text-ink">{children}</dd>
    </div>
  );
}

function PassOrFail({ verdict }: { verdict: 'pass' | 'fail' | undefined }) {
  if (!verdict) return <span className="text-ink-muted">no limit</span>;
  return verdict === 'pass' ? (
    <span className="font-semibold text-tide-800">■ meets the limit</span>
  ) : (
    <span className="font-semibold text-ember-700">□ exceeds the limit</span>
  );
}

function InShort({ summary }: { summary: ReturnType<typeof decisionSummary> }) {
  const meets = summary.tone === 'meets';
  return (
    <div
      data-testid="decision-in-short"
      className={`rounded-plate border-l-4 px-4 py-3 text-small ${meets ? 'border-tide-700 bg-tide-50 text-ink' : 'border-ember-600 bg-ember-50 text-ink'}`}
    >
      <p className={`font-semibold ${meets ? 'text-tide-800' : 'text-ember-700'}`}>
        In short: {meets ? 'the design meets the comfort criteria' : 'the design does not meet the comfort criteria everywhere'}
      </p>
      <p className="mt-1">{summary.sentences.join(' ')}</p>
    </div>
  );
}

/**
 * A submitted design read as a decision: what the owner is asked to accept, all from the snapshot taken at submission
 * (nothing is recomputed here), then the owner's approve or return.
 */
export function SignOffDecision({ projectId, signOff, canDecide, personName, criteriaInWords }: SignOffDecisionProps) {
  const { snapshot } = signOff;
  const { variant, mode, criteria, loadCases } = snapshot;
  const result = variant.result;
  const loadCaseName = (id: string) => loadCases.find((lc) => lc.id === id)?.name ?? 'load case';

  return (
    <section aria-labelledby={`decision-${signOff.id}`} className="flex flex-col gap-5 rounded-plate border border-paper-line bg-paper-raised p-5">
      <header className="flex flex-col gap-1">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id={`decision-${signOff.id}`} className="text-headline font-semibold text-ink">
            {signOff.status === 'submitted' ? 'Decision asked' : 'Design as submitted'}: {variant.name}
          </h2>
          <SignOffStatusTag status={signOff.status} />
        </div>
        <p className="text-small text-ink-soft">
          {personName(signOff.submittedBy)} submitted this design on {formatDateTime(signOff.submittedAt)}
          {signOff.status === 'submitted'
            ? ' and asks the owner to accept the comfort criteria below and the damper that meets them.'
            : `; it was ${signOff.status} on ${signOff.decidedAt ? formatDateTime(signOff.decidedAt) : 'a later date'}.`}
        </p>
        {signOff.message ? <blockquote className="border-l-2 border-paper-line pl-3 text-small text-ink">“{signOff.message}”</blockquote> : null}
      </header>

      {result ? <InShort summary={decisionSummary(result, loadCaseName)} /> : null}

      <div className="flex flex-col gap-2">
        <h3 className="font-semibold text-ink">1. The comfort the structure must give — {criteria.name}</h3>
        <div className="text-small" data-testid="decision-criteria">
          {criteriaInWords}
        </div>
      </div>

      <div className="flex flex-col gap-2">
        <h3 className="font-semibold text-ink">2. The structure and the damper</h3>
        <p className="text-small text-ink-soft">
          Mode {mode.label}: {formatQuantity(mode.frequencyHz, 'Hz')}, modal mass {formatQuantity(mode.modalMassKg, 'kg')}, damping ratio{' '}
          {formatPercent(mode.dampingRatio)}.
        </p>
        {result ? (
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
            <Fact label="Mass ratio (damper / modal mass)">{formatPercent(result.massRatio)}</Fact>
            <Fact label="Damper moving mass">
              {formatQuantity(result.tmd.massKg, 'kg')}
              {result.unitCount > 1 ? ` in ${result.unitCount} units` : ''}
            </Fact>
            <Fact label="Damper frequency">{formatQuantity(result.tmd.frequencyHz, 'Hz')}</Fact>
            <Fact label="Damper damping ratio (to its own frequency)">{formatPercent(result.tmd.dampingRatio)}</Fact>
          </dl>
        ) : (
          <Notice tone="error" title="The snapshot holds no result">
            {variant.resultError?.message ?? 'The design was submitted without a computed result; return it.'}
          </Notice>
        )}
      </div>

      {result ? (
        <>
          <div className="flex flex-col gap-2">
            <h3 className="font-semibold text-ink">3. What people will feel, load case by load case</h3>
            <p className="text-small text-ink-soft">
              The margin is what is left below the limit: 1 − peak / limit. A negative margin means the limit is exceeded.
            </p>
            <Table caption="Verdict per load case">
              <thead>
                <tr>
                  <Th>Load case</Th>
                  <Th>Peak acceleration</Th>
                  <Th>Limit</Th>
                  <Th>Margin</Th>
                  <Th>Verdict</Th>
                </tr>
              </thead>
              <tbody>
                {result.loadCases.map((lc) => (
                  <tr key={lc.loadCaseId} data-testid="decision-load-case">
                    <Td>{lc.name}</Td>
                    <Td className="whitespace-nowrap tabular-nums">{formatQuantity(lc.peakAccelerationMPerS2, 'm/s²', 4)}</Td>
                    <Td className="whitespace-nowrap tabular-nums">{lc.criterion ? formatQuantity(lc.criterion.limitMPerS2, 'm/s²', 4) : '—'}</Td>
                    <Td className="whitespace-nowrap tabular-nums">{lc.utilisation === undefined ? '—' : formatPercent(1 - lc.utilisation)}</Td>
                    <Td>
                      <PassOrFail verdict={lc.verdict} />
                      {lc.comfortClass ? <span className="ml-2 text-caption text-ink-muted">comfort reached: {lc.comfortClass}</span> : null}
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          </div>

          <div className="flex flex-col gap-2">
            <h3 className="font-semibold text-ink">4. If the bridge is not quite as modelled</h3>
            <p className="text-small text-ink-soft">
              With the structure’s frequency anywhere from {formatQuantity(result.detuning.structureFrequencyRangeHz[0], 'Hz')} to{' '}
              {formatQuantity(result.detuning.structureFrequencyRangeHz[1], 'Hz')} (±{formatPercent(result.detuning.structureFrequencyToleranceRatio)}
              {result.detuning.tmdDampingToleranceRatio === null
                ? ''
                : `, damper damping ratio ±${formatPercent(result.detuning.tmdDampingToleranceRatio)}`}
              ), the worst case is {formatQuantity(result.detuning.worstPeakAccelerationMPerS2, 'm/s²', 4)} under{' '}
              {loadCaseName(result.detuning.loadCaseId)} at {formatQuantity(result.detuning.atStructureFrequencyHz, 'Hz')}: margin{' '}
              {formatPercent(1 - result.detuning.worstUtilisation)}, <PassOrFail verdict={result.detuning.verdict} />.
            </p>
          </div>

          <div className="flex flex-col gap-2">
            <h3 className="font-semibold text-ink">5. Warnings</h3>
            {result.warnings.length === 0 ? (
              <p className="text-small text-ink-soft">The engine raised no warning for this design.</p>
            ) : (
              <ul className="list-disc pl-5 text-small text-ink">
                {result.warnings.map((warning) => (
                  <li key={warning.code}>{warning.message}</li>
                ))}
              </ul>
            )}
          </div>
        </>
      ) : null}

      <p className="text-caption text-ink-muted">
        These figures are those of the design as submitted (engine {snapshot.engineVersion}); they do not change when the project does.
      </p>
      <Caution />

      {signOff.status === 'submitted' ? (
        canDecide ? (
          <DecisionForms projectId={projectId} signOffId={signOff.id} />
        ) : (
          <p className="text-small text-ink-muted">An owner of the organisation approves or returns this design; you read it.</p>
        )
      ) : null}
    </section>
  );
}

function DecisionForms({ projectId, signOffId }: { projectId: string; signOffId: string }) {
  const decide = useDecideSignOff(projectId);
  const [formError, setFormError] = useState<string | null>(null);
  const approve = useForm<ApproveSignOffInput>({ resolver: zodResolver(approveSignOffSchema), defaultValues: { comment: '' } });
  const giveBack = useForm<ReturnSignOffInput>({ resolver: zodResolver(returnSignOffSchema), defaultValues: { comment: '' } });

  const onError = (form: typeof approve | typeof giveBack) => (error: unknown) => {
    const issues = issuesFor(error, 'comment');
    if (issues.length > 0) form.setError('comment', { type: 'server', message: issueMessage(issues[0]) }, { shouldFocus: true });
    else setFormError(isApiError(error) && error.isConflict ? `Already decided: ${describeError(error)}` : describeError(error));
  };

  return (
    <div className="grid gap-4 md:grid-cols-2">
      {formError ? (
        <div className="md:col-span-2">
          <Notice tone="error" title="The decision was not recorded">
            {formError}
          </Notice>
        </div>
      ) : null}
      <form
        aria-label="Approve the design"
        noValidate
        className="flex flex-col gap-3 rounded-plate border border-tide-200 p-4"
        onSubmit={approve.handleSubmit((values) => {
          setFormError(null);
          const comment = values.comment?.trim();
          decide.mutate({ id: signOffId, decision: 'approve', input: comment ? { comment } : {} }, { onError: onError(approve) });
        })}
      >
        <TextAreaField
          label="Comment on approval"
          optional
          rows={3}
          error={approve.formState.errors.comment?.message}
          {...approve.register('comment')}
        />
        <Button type="submit" busy={decide.isPending && decide.variables?.decision === 'approve'} disabled={decide.isPending}>
          Approve
        </Button>
      </form>
      <form
        aria-label="Return the design"
        noValidate
        className="flex flex-col gap-3 rounded-plate border border-ember-100 p-4"
        onSubmit={giveBack.handleSubmit((values) => {
          setFormError(null);
          decide.mutate({ id: signOffId, decision: 'return', input: values }, { onError: onError(giveBack) });
        })}
      >
        <TextAreaField
          label="What to change"
          hint="Required: the engineer reads it with the returned design."
          rows={3}
          error={giveBack.formState.errors.comment?.message}
          {...giveBack.register('comment')}
        />
        <Button type="submit" tone="danger-outline" busy={decide.isPending && decide.variables?.decision === 'return'} disabled={decide.isPending}>
          Return
        </Button>
      </form>
    </div>
  );
}
