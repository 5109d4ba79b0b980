/**
 * Sign-off: an engineer or admin submits a tuning variant with a snapshot of everything its approval rests on; an
 * owner approves or returns it, once. The comfort criteria's status follows in the same transaction, and the mails
 * go to the outbox in that transaction too, sent after commit in the background (docs/decisions/0019-sign-off-freeze.md).
 */
import type { Database } from '../../db/client';
import type { AppContext } from '../../context';
import { HttpError, invalidField, notFound } from '../../lib/http-error';
import { pgErrorCode } from '../../lib/pg-errors';
import type { CurrentUser } from '../../middleware/auth';
import { enqueueMails } from '../../mail/outbox';
import { signOffDecidedMail, signOffSubmittedMail } from '../../mail/templates';
import type { OutgoingMail } from '../../mail/mailer';
import type { ApproveSignOffInput, ReturnSignOffInput, SignOff, SignOffSnapshot, SubmitSignOffInput } from '../../../shared/contracts/sign-offs';
import { requireProjectScope } from '../structures/structures.service';
import type { ProjectScope } from '../structures/structures.repository';
import * as variantsRepository from '../variants/variants.repository';
import { getVariant, noResultReason } from '../variants/variants.service';
import { toSavedMode } from '../modes/modes.service';
import { toSavedLoadCase } from '../load-cases/load-cases.service';
import { toComfortCriteria } from '../comfort-criteria/comfort-criteria.service';
import * as repository from './sign-offs.repository';
import { asActor } from '../../db/actor';

const UNIQUE_VIOLATION = '23505';
const signOffNotFound = () => notFound('The sign-off', 'sign_off_not_found');

function toSignOff(row: repository.SignOffRow, mails: repository.OutboxRow[]): SignOff {
  return {
    id: row.id,
    projectId: row.projectId,
    variantId: row.variantId,
    criteriaId: row.criteriaId,
    status: row.status,
    message: row.message,
    submittedBy: row.submittedBy,
    submittedAt: row.submittedAt.toISOString(),
    decidedBy: row.decidedBy,
    decidedByName: row.decidedByName,
    decidedByEmail: row.decidedByEmail,
    decidedAt: row.decidedAt ? row.decidedAt.toISOString() : null,
    decisionComment: row.decisionComment,
    snapshot: row.snapshot,
    mails: mails.filter((m) => m.signOffId === row.id).map((m) => ({ to: m.toAddress, state: m.state, attempts: m.attempts })),
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

async function withMails(db: Database, row: repository.SignOffRow): Promise<SignOff> {
  return toSignOff(row, await repository.mailsOf(db, [row.id]));
}

const signOffLink = (ctx: AppContext, projectId: string) => `${ctx.env.appUrl}/projects/${projectId}/sign-off`;

export async function listSignOffs(db: Database, user: CurrentUser, projectId: string): Promise<SignOff[]> {
  const scope = await requireProjectScope(db, user, projectId);
  const rows = await repository.listSignOffs(db, scope);
  const mails = await repository.mailsOf(db, rows.map((r) => r.id));
  return rows.map((row) => toSignOff(row, mails));
}

export async function getSignOff(db: Database, user: CurrentUser, projectId: string, id: string): Promise<SignOff> {
  const scope = await requireProjectScope(db, user, projectId);
  const row = await repository.findSignOff(db, scope, id);
  if (!row) throw signOffNotFound();
  return withMails(db, row);
}

/** Everything the approval rests on, read now (the variant through its service, so its result is fresh). */
async function snapshotOf(ctx: AppContext, user: CurrentUser, scope: ProjectScope, variantId: string): Promise<SignOffSnapshot> {
  const variant = await getVariant(ctx.db, ctx.enginePool, user, scope.projectId, variantId);
  if (!variant.result) {
    const why = noResultReason(variant);
    throw new HttpError(409, 'variant_without_result', `The tuning variant cannot be submitted: ${why}; change it so that it computes, then submit`, [
      { path: 'variantId', message: `has no result: ${why}` },
    ]);
  }
  const mode = await variantsRepository.findProjectMode(ctx.db, scope, variant.modeId);
  const loadCaseRows = await variantsRepository.findProjectLoadCases(ctx.db, scope, variant.loadCaseIds);
  const criteria = await variantsRepository.findProjectCriteria(ctx.db, scope, variant.criteriaId);
  const loadCases = variant.loadCaseIds.map((id) => loadCaseRows.find((r) => r.id === id));
  if (!mode || !criteria || loadCases.some((l) => !l)) {
    throw new HttpError(409, 'variant_inputs_missing', 'A mode, load case or criteria of this tuning variant is missing');
  }
  return {
    variant,
    mode: toSavedMode(mode, scope.projectId),
    loadCases: loadCases.map((row) => toSavedLoadCase(row as NonNullable<typeof row>)),
    criteria: toComfortCriteria(criteria),
    engineVersion: variant.result.engineVersion,
  };
}

const alreadySubmitted = () =>
  new HttpError(409, 'sign_off_pending', 'This tuning variant already waits for a sign-off decision; the owner approves or returns it first', [
    { path: 'variantId', message: 'already has a submitted sign-off without a decision' },
  ]);

export async function submitSignOff(ctx: AppContext, user: CurrentUser, projectId: string, input: SubmitSignOffInput): Promise<SignOff> {
  const { db } = ctx;
  const scope = await requireProjectScope(db, user, projectId);
  if (!(await variantsRepository.findVariant(db, scope, input.variantId))) throw invalidField('variantId', 'is not a tuning variant of this project');
  if (await repository.findUndecided(db, input.variantId)) throw alreadySubmitted();
  const snapshot = await snapshotOf(ctx, user, scope, input.variantId);
  const name = await repository.projectName(db, projectId);
  let mailIds: string[] = [];
  let row: repository.SignOffRow;
  try {
    row = await asActor(db, user, async (tx) => {
      const inserted = await repository.insertSignOff(tx, scope, {
        variantId: input.variantId,
        criteriaId: snapshot.criteria.id,
        message: input.message ? input.message : null,
        submittedBy: user.id,
        snapshot,
      });
      await repository.setCriteriaStatus(tx, snapshot.criteria.id, 'submitted');
      const owners = await repository.ownersOf(tx, scope.organisationId);
      const mails: OutgoingMail[] = owners.map((owner) =>
        signOffSubmittedMail({
          to: owner.email,
          link: signOffLink(ctx, projectId),
          projectName: name,
          variantName: snapshot.variant.name,
          submitterName: user.name || user.email,
          message: inserted.message,
        }),
      );
      mailIds = await enqueueMails(tx, inserted.id, mails);
      return inserted;
    });
  } catch (error) {
    if (pgErrorCode(error) === UNIQUE_VIOLATION) throw alreadySubmitted();
    throw error;
  }
  // Sent in the background: the answer does not wait for the mail relay (the mails read `pending` until then).
  ctx.outbox.sendSoon(mailIds);
  return withMails(db, row);
}

const designChanged = () =>
  new HttpError(409, 'design_changed_since_submission', 'The design changed after it was submitted, so this sign-off no longer describes it; return it and submit again', [
    { path: '', message: 'the variant, its mode, load cases or comfort criteria changed after submission' },
  ]);

async function decideSignOff(
  ctx: AppContext,
  user: CurrentUser,
  projectId: string,
  id: string,
  decision: 'approved' | 'returned',
  comment: string | null,
): Promise<SignOff> {
  const { db } = ctx;
  const scope = await requireProjectScope(db, user, projectId);
  const current = await repository.findSignOff(db, scope, id);
  if (!current) throw signOffNotFound();
  const name = await repository.projectName(db, projectId);
  let mailIds: string[] = [];
  const row = await asActor(db, user, async (tx) => {
    if (decision === 'approved') {
      const now = await repository.lockedVersions(tx, current.snapshot);
      const s = current.snapshot;
      const same =
        now.variantVersion === s.variant.version &&
        now.loadCaseIds.join(',') === s.variant.loadCaseIds.join(',') &&
        now.modeVersion === s.mode.version &&
        s.loadCases.every((l) => now.loadCaseVersions.get(l.id) === l.version) &&
        now.criteriaUnchanged;
      if (!same) throw designChanged();
    }
    const decider = await repository.findUser(tx, user.id);
    const decided = await repository.decide(tx, scope, id, {
      status: decision,
      decidedBy: user.id,
      decisionComment: comment,
      decidedByName: (decider ? decider.name : user.name) || null,
      decidedByEmail: decider?.email ?? user.email,
      decidedProjectName: name,
    });
    if (!decided) {
      throw new HttpError(409, 'sign_off_decided', `This sign-off was already ${current.status === 'submitted' ? 'decided' : current.status}; a decision is made once`, [
        { path: '', message: 'the sign-off is no longer waiting for a decision' },
      ]);
    }
    await repository.setCriteriaStatus(tx, decided.criteriaId, decision);
    const submitter = decided.submittedBy ? await repository.findUser(tx, decided.submittedBy) : undefined;
    if (submitter) {
      mailIds = await enqueueMails(tx, decided.id, [
        signOffDecidedMail({
          to: submitter.email,
          link: signOffLink(ctx, projectId),
          projectName: name,
          variantName: decided.snapshot.variant.name,
          deciderName: user.name || user.email,
          decision,
          comment,
        }),
      ]);
    }
    return decided;
  });
  // Sent in the background: the answer does not wait for the mail relay (the mails read `pending` until then).
  ctx.outbox.sendSoon(mailIds);
  return withMails(db, row);
}

export function approveSignOff(ctx: AppContext, user: CurrentUser, projectId: string, id: string, input: ApproveSignOffInput): Promise<SignOff> {
  return decideSignOff(ctx, user, projectId, id, 'approved', input.comment ? input.comment : null);
}

export function returnSignOff(ctx: AppContext, user: CurrentUser, projectId: string, id: string, input: ReturnSignOffInput): Promise<SignOff> {
  return decideSignOff(ctx, user, projectId, id, 'returned', input.comment);
}
