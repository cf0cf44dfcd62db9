/**
 * The table of mail kinds and the templates are held together: every template the server can
 * send has an entry (so "E-mails Quietband sends you" lists it), and every entry names a real
 * template. A new template without an entry fails here.
 */
import { describe, expect, it } from 'vitest'
import { MAIL_KIND_NAMES, MAIL_KINDS, mailKindsFor } from '../../shared/domain/mail-kinds'
import * as accountTemplates from '../../server/mail/templates'
import * as caseTemplates from '../../server/mail/case-templates'
import * as notificationTemplates from '../../server/mail/notification-templates'

/** The functions that write one kind of message (composeMail is the builder, not a kind). */
const templates = Object.keys({ ...accountTemplates, ...caseTemplates, ...notificationTemplates }).filter((k) => k.endsWith('Mail') && k !== 'composeMail').sort()

describe('the table of mail kinds', () => {
  it('has one entry for every template, and no entry without a template', () => {
    expect([...MAIL_KIND_NAMES].sort()).toEqual(templates)
  })

  it('gives every kind at least one receiving role and a sentence saying when it is sent', () => {
    for (const k of MAIL_KIND_NAMES) {
      expect(MAIL_KINDS[k].to.length, k).toBeGreaterThan(0)
      expect(MAIL_KINDS[k].when, k).toMatch(/^[A-Z].{10,}\.$/)
    }
  })

  it('lists for a role exactly the kinds that name it', () => {
    expect(mailKindsFor('investigator')).toContain('investigatorAssignedMail')
    expect(mailKindsFor('investigator')).not.toContain('safetyReportMail')
    expect(mailKindsFor('complainant')).toContain('reportReceivedMail')
    expect(mailKindsFor('complainant')).not.toContain('officeDigestMail')
  })
})
