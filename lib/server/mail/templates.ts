import 'server-only';
import type { OutgoingMail } from './mailer';

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function layout(title: string, paragraphs: string[], action: { label: string; url: string }, footer: string): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 14px">${escapeHtml(p)}</p>`).join('');
  return `<!doctype html><html><body style="background:#FAF7F0;color:#23262B;font-family:Helvetica,Arial,sans-serif;padding:24px">
<div style="max-width:520px;margin:auto;border-top:1px solid #DDD6C8;padding-top:16px">
<h1 style="font-size:18px;margin:0 0 16px">${escapeHtml(title)}</h1>${body}
<p style="margin:20px 0"><a href="${escapeHtml(action.url)}" style="background:#0E5D63;color:#fff;padding:10px 16px;text-decoration:none;border-radius:3px">${escapeHtml(action.label)}</a></p>
<p style="font-size:12px;color:#5E5C57">${escapeHtml(footer)}</p></div></body></html>`;
}

function mail(to: string, subject: string, paragraphs: string[], action: { label: string; url: string }, footer: string): OutgoingMail {
  return {
    to,
    subject,
    text: [...paragraphs, `${action.label}: ${action.url}`, footer].join('\n\n'),
    html: layout(subject, paragraphs, action, footer),
  };
}

export function invitationMail(p: { to: string; labName: string; roleLabel: string; inviterName: string; url: string; expiresAt: Date }) {
  return mail(
    p.to,
    `Join ${p.labName} on Epicycle`,
    [`${p.inviterName} invites you to ${p.labName} as ${p.roleLabel}.`, `The link works once and expires on ${p.expiresAt.toUTCString()}.`],
    { label: 'Accept the invitation', url: p.url },
    'If you did not expect this, ignore this message.',
  );
}

export function signInLinkMail(p: { to: string; url: string }) {
  return mail(p.to, 'Your Epicycle sign-in link', ['Use this link to sign in. It works once and expires in 24 hours.'], { label: 'Sign in', url: p.url }, 'If you did not ask for it, ignore this message.');
}

export function passwordResetMail(p: { to: string; url: string }) {
  return mail(
    p.to,
    'Reset your Epicycle password',
    ['Use this link to choose a new password. It works once and expires in one hour. Other sessions are signed out when you change it.'],
    { label: 'Choose a new password', url: p.url },
    'If you did not ask for it, your password is unchanged; ignore this message.',
  );
}

export function editionSubmittedMail(p: { to: string; submitter: string; spaceName: string; number: number; changeNote: string; url: string }) {
  return mail(
    p.to,
    `Review requested: ${p.spaceName}, edition ${p.number}`,
    [`${p.submitter} asks you to review edition ${p.number} of ${p.spaceName}.`, p.changeNote ? `Their note: ${p.changeNote}` : 'They left no note.'],
    { label: 'Open the review', url: p.url },
    'You receive this because you review editions in this lab.',
  );
}

export function editionDecidedMail(p: { to: string; decider: string; spaceName: string; number: number; approved: boolean; note: string; url: string }) {
  return mail(
    p.to,
    `${p.spaceName}, edition ${p.number}: ${p.approved ? 'approved' : 'returned'}`,
    [
      p.approved ? `${p.decider} approved edition ${p.number} of ${p.spaceName}. Studies and packs can now use it.` : `${p.decider} returned edition ${p.number} of ${p.spaceName}.`,
      p.note ? `Their note: ${p.note}` : 'They left no note.',
      ...(p.approved ? [] : ['Change the space, then freeze a new edition; it supersedes this one.']),
    ],
    { label: 'Open the edition', url: p.url },
    'You receive this because you froze this edition.',
  );
}
