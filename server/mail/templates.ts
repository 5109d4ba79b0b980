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
