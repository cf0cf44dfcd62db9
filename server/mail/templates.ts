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

export function confirmAddressMail(opts: { to: string; name: string; link: string; expiresHours: number }): OutgoingMail {
  return composeMail(opts.to, 'Confirm your e-mail address for Quietband', [
    `Hello ${opts.name},`,
    'Someone, most likely you, created a Quietband account with this e-mail address. To start using it, confirm the address with this link:',
    opts.link,
    `The link works once and expires in ${opts.expiresHours} hours. Once the address is confirmed, your account also lists the reports you filed with it without signing in.`,
    'If you did not create this account, do not follow the link: ignore this message and the account will never work.',
  ])
}

export function alreadyRegisteredMail(opts: { to: string; name: string; signInLink: string; resetLink: string }): OutgoingMail {
  return composeMail(opts.to, 'Someone tried to create a Quietband account with your address', [
    `Hello ${opts.name},`,
    'Someone, perhaps you, tried to create a Quietband account with this e-mail address. You already have one, so nothing was created and nothing has changed.',
    'If it was you, sign in here:',
    opts.signInLink,
    'If you do not remember your password, or never confirmed your address, ask for a link to choose a new password (this also confirms the address):',
    opts.resetLink,
    'If it was not you, you can ignore this message.',
  ])
}

export function noAccountResetMail(opts: { to: string; registerLink: string }): OutgoingMail {
  return composeMail(opts.to, 'About your Quietband password request', [
    'Hello,',
    'Someone, perhaps you, asked to reset the password of a Quietband account for this e-mail address. There is no account you can use with this address, so no password was changed.',
    'If it was you, you may have signed up with another address. You can also create an account here (reporting interference never needs one):',
    opts.registerLink,
    'If it was not you, you can ignore this message.',
  ])
}
