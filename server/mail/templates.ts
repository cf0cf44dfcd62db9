/** Quietband's own e-mail words: plain text plus simple HTML built from the same lines. */
import type { OutgoingMail } from './mailer'

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!)
}

/** Builds a message from paragraphs; a paragraph that is a URL becomes a link in the HTML part. */
export function composeMail(to: string, subject: string, paragraphs: string[]): OutgoingMail {
  const footer = 'Quietband — interference complaints handled by your regional field office.'
  const text = [...paragraphs, '—', footer].join('\n\n')
  const html = [
    '<div style="font-family:sans-serif;max-width:36rem;line-height:1.5">',
    ...paragraphs.map((p) =>
      /^https?:\/\/\S+$/.test(p) ? `<p><a href="${escapeHtml(p)}">${escapeHtml(p)}</a></p>` : `<p>${escapeHtml(p)}</p>`,
    ),
    `<p style="color:#666;font-size:0.85em">${escapeHtml(footer)}</p>`,
    '</div>',
  ].join('\n')
  return { to, subject, text, html }
}

export function staffInvitationMail(opts: { to: string; name: string; link: string; expiresHours: number }): OutgoingMail {
  return composeMail(opts.to, 'Your Quietband staff account', [
    `Hello ${opts.name},`,
    'An administrator has created a Quietband account for you. Choose your password with this link:',
    opts.link,
    `The link works once and expires in ${opts.expiresHours} hours. If you did not expect this message, you can ignore it.`,
  ])
}

export function passwordResetMail(opts: { to: string; name: string; link: string; expiresMinutes: number }): OutgoingMail {
  return composeMail(opts.to, 'Reset your Quietband password', [
    `Hello ${opts.name},`,
    'Someone asked to reset the password of your Quietband account. Choose a new password with this link:',
    opts.link,
    `The link works once and expires in ${opts.expiresMinutes} minutes. If you did not ask for it, ignore this message: your password stays as it is.`,
  ])
}
