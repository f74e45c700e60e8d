import type { OutgoingMail } from './mail';

const esc = (s: string) =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');

// Families whose builds carry dangerous voltages (tube plate supplies, mains-fed relay supplies).
const HAZARDOUS_FAMILIES = new Set(['tube-drl-nor', 'relay']);
const SAFETY_LINE =
  'Caution: vacuum-tube and mains-powered relay circuits carry voltages that can injure or kill. ' +
  'Follow your local electrical codes and qualified practice when you build this circuit.';

function compose(to: string, subject: string, paragraphs: string[], link?: { url: string; label: string }): OutgoingMail {
  const textParts = [...paragraphs];
  if (link) textParts.splice(1, 0, `${link.label}: ${link.url}`);
  const text = `${textParts.join('\n\n')}\n\n-- Gatefold\n`;
  const htmlParas = paragraphs.map((p) => `<p>${esc(p)}</p>`);
  if (link) htmlParas.splice(1, 0, `<p><a href="${esc(link.url)}">${esc(link.label)}</a><br>${esc(link.url)}</p>`);
  const html = `<!doctype html><html><body style="font-family: sans-serif">${htmlParas.join('')}<p>-- Gatefold</p></body></html>`;
  return { to, subject, text, html };
}

function safety(family: string): string[] {
  return HAZARDOUS_FAMILIES.has(family) ? [SAFETY_LINE] : [];
}

export function memberAddedMail(p: { to: string; inviter: string; boardTitle: string; family: string; role: string; url: string }): OutgoingMail {
  return compose(
    p.to,
    `${p.inviter} added you to "${p.boardTitle}"`,
    [`${p.inviter} added you to the Gatefold board "${p.boardTitle}" as ${p.role}.`, ...safety(p.family)],
    { url: p.url, label: 'Open the board' },
  );
}

export function invitationMail(p: { to: string; inviter: string; boardTitle: string; family: string; role: string; url: string }): OutgoingMail {
  return compose(
    p.to,
    `${p.inviter} invited you to "${p.boardTitle}"`,
    [
      `${p.inviter} invited you to the Gatefold board "${p.boardTitle}" as ${p.role}. Open the link, create an account (or sign in), and accept.`,
      'The link works once and expires in 14 days.',
      ...safety(p.family),
    ],
    { url: p.url, label: 'Accept the invitation' },
  );
}

export function passwordResetMail(p: { to: string; name: string; url: string }): OutgoingMail {
  return compose(
    p.to,
    'Reset your Gatefold password',
    [
      `Hello ${p.name}, someone (we hope you) asked to reset the password of your Gatefold account.`,
      'The link works once and expires in one hour. If you did not ask, ignore this message; your password stays as it is.',
    ],
    { url: p.url, label: 'Choose a new password' },
  );
}
