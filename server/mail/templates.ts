import type { Role } from '../../shared/contracts/roles';
import type { OutgoingMail } from './mailer';

const roleWords: Record<Role, string> = {
  admin: 'an admin (manages the organisation’s people and roles)',
  engineer: 'an engineer (creates projects and designs the dampers)',
  owner: 'an owner (approves the comfort criteria and the chosen design)',
  fabricator: 'a fabricator (reads the released hardware sheets)',
  viewer: 'a viewer (reads everything, changes nothing)',
};

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);
}

export function invitationMail(input: {
  to: string;
  link: string;
  organisationName: string;
  inviterName: string;
  role: Role;
  expiresAt: Date;
}): OutgoingMail {
  const expires = input.expiresAt.toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
  const text = [
    `${input.inviterName} invites you to join ${input.organisationName} on Stillspan as ${roleWords[input.role]}.`,
    '',
    'Open this link to choose your password and join:',
    input.link,
    '',
    `The link works once and until ${expires}. If you did not expect this mail, ignore it.`,
  ].join('\n');
  const html = `<p>${escapeHtml(input.inviterName)} invites you to join <strong>${escapeHtml(input.organisationName)}</strong> on Stillspan as ${escapeHtml(roleWords[input.role])}.</p>
<p><a href="${escapeHtml(input.link)}">Choose your password and join</a></p>
<p>The link works once and until ${escapeHtml(expires)}. If you did not expect this mail, ignore it.</p>`;
  return { to: input.to, subject: `Join ${input.organisationName} on Stillspan`, text, html };
}

const caution = 'Stillspan’s results support, and never replace, the judgement of a qualified engineer; local codes and licensed practice govern.';

/** To each owner of the organisation: a design waits for their decision. */
export function signOffSubmittedMail(input: {
  to: string;
  link: string;
  projectName: string;
  variantName: string;
  submitterName: string;
  message: string | null;
}): OutgoingMail {
  const text = [
    `${input.submitterName} submitted the tuning variant "${input.variantName}" of the project ${input.projectName} for your sign-off.`,
    ...(input.message ? ['', 'Their message:', input.message] : []),
    '',
    'Review it and approve or return it here:',
    input.link,
    '',
    caution,
  ].join('\n');
  const html = `<p>${escapeHtml(input.submitterName)} submitted the tuning variant <strong>${escapeHtml(input.variantName)}</strong> of the project ${escapeHtml(input.projectName)} for your sign-off.</p>
${input.message ? `<p>Their message:</p><blockquote>${escapeHtml(input.message)}</blockquote>` : ''}
<p><a href="${escapeHtml(input.link)}">Review and decide</a></p>
<p>${escapeHtml(caution)}</p>`;
  return { to: input.to, subject: `Sign-off requested: ${input.variantName} (${input.projectName})`, text, html };
}

/** To the person who submitted: the owner approved or returned the design. */
export function signOffDecidedMail(input: {
  to: string;
  link: string;
  projectName: string;
  variantName: string;
  deciderName: string;
  decision: 'approved' | 'returned';
  comment: string | null;
}): OutgoingMail {
  const verb = input.decision === 'approved' ? 'approved' : 'returned';
  const next =
    input.decision === 'approved'
      ? 'The design is now frozen: to change it, copy the variant and submit again.'
      : 'You can change the design and submit it again.';
  const text = [
    `${input.deciderName} ${verb} the tuning variant "${input.variantName}" of the project ${input.projectName}.`,
    ...(input.comment ? ['', 'Comment:', input.comment] : []),
    '',
    next,
    input.link,
    '',
    caution,
  ].join('\n');
  const html = `<p>${escapeHtml(input.deciderName)} ${verb} the tuning variant <strong>${escapeHtml(input.variantName)}</strong> of the project ${escapeHtml(input.projectName)}.</p>
${input.comment ? `<p>Comment:</p><blockquote>${escapeHtml(input.comment)}</blockquote>` : ''}
<p>${escapeHtml(next)}</p>
<p><a href="${escapeHtml(input.link)}">Open the sign-off</a></p>
<p>${escapeHtml(caution)}</p>`;
  return { to: input.to, subject: `Design ${verb}: ${input.variantName} (${input.projectName})`, text, html };
}
