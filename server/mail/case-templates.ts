/** E-mails about cases, in Quietband's own words. Every one names the case reference. */
import { RESOLUTION_LABELS, type Resolution } from '../../shared/domain/case-lifecycle'
import { PRIORITY_LABELS, SERVICE_LABELS, type AffectedService, type Priority } from '../../shared/domain/services'
import { composeMail } from './templates'
import type { OutgoingMail } from './mailer'

interface CaseRef {
  reference: string
  complainantName: string
  complainantEmail: string
}

const keepLink = 'This link is private to you: anyone who has it can read and add to your report.'

export function reportReceivedMail(c: CaseRef & { officeName: string }, trackingLink: string): OutgoingMail {
  return composeMail(c.complainantEmail, `[${c.reference}] We have received your interference report`, [
    `Hello ${c.complainantName},`,
    `Thank you. Your report is registered as ${c.reference} and has gone to our ${c.officeName} field office.`,
    'Follow its progress, add information or withdraw it here:',
    trackingLink,
    keepLink,
    'If anyone’s safety is at risk, also call the emergency services.',
  ])
}

export function caseAssignedComplainantMail(c: CaseRef, trackingLink: string): OutgoingMail {
  return composeMail(c.complainantEmail, `[${c.reference}] An engineer is looking into your report`, [
    `Hello ${c.complainantName},`,
    `A field engineer has been assigned to ${c.reference}. They may contact you to arrange measurements.`,
    'Follow the case here:',
    trackingLink,
    keepLink,
  ])
}

export function informationRequestedMail(c: CaseRef, question: string, trackingLink: string): OutgoingMail {
  return composeMail(c.complainantEmail, `[${c.reference}] We need some information from you`, [
    `Hello ${c.complainantName},`,
    `The engineers working on ${c.reference} ask:`,
    question,
    'Please answer on your case page:',
    trackingLink,
    keepLink,
  ])
}

export function messageToComplainantMail(c: CaseRef, message: string, trackingLink: string): OutgoingMail {
  return composeMail(c.complainantEmail, `[${c.reference}] A message about your report`, [
    `Hello ${c.complainantName},`,
    message,
    'Your case page:',
    trackingLink,
  ])
}

export function caseClosedMail(c: CaseRef, resolution: Resolution, summary: string, trackingLink: string): OutgoingMail {
  return composeMail(c.complainantEmail, `[${c.reference}] Your report is closed`, [
    `Hello ${c.complainantName},`,
    `We have closed ${c.reference}. Outcome: ${RESOLUTION_LABELS[resolution]}.`,
    summary,
    'If the interference comes back, reply on your case page and we will look again:',
    trackingLink,
  ])
}

export function caseReopenedMail(c: CaseRef, reason: string, trackingLink: string): OutgoingMail {
  return composeMail(c.complainantEmail, `[${c.reference}] Your report is open again`, [
    `Hello ${c.complainantName},`,
    `We have reopened ${c.reference}: ${reason}`,
    'Follow the case here:',
    trackingLink,
  ])
}

export function investigatorAssignedMail(to: { name: string; email: string }, c: { reference: string; priority: Priority; service: AffectedService; address: string }, caseLink: string): OutgoingMail {
  return composeMail(to.email, `[${c.reference}] Assigned to you — priority ${c.priority}`, [
    `Hello ${to.name},`,
    `${c.reference} is now yours: priority ${c.priority} (${PRIORITY_LABELS[c.priority].long}), ${SERVICE_LABELS[c.service]}, at ${c.address}.`,
    caseLink,
  ])
}

export function safetyReportMail(to: { name: string; email: string }, c: { reference: string; service: AffectedService; address: string }, caseLink: string): OutgoingMail {
  return composeMail(to.email, `[${c.reference}] Priority 1: safety-of-life report received`, [
    `Hello ${to.name},`,
    `A new report affecting ${SERVICE_LABELS[c.service]} at ${c.address} was suggested priority 1 (safety of life). Triage it now:`,
    caseLink,
  ])
}

export function findingProposedMail(to: { name: string; email: string }, c: { reference: string }, investigatorName: string, caseLink: string): OutgoingMail {
  return composeMail(to.email, `[${c.reference}] Finding ready for your review`, [
    `Hello ${to.name},`,
    `${investigatorName} has proposed a finding on ${c.reference}. Review it, then approve and close or send it back:`,
    caseLink,
  ])
}

export function findingReturnedMail(to: { name: string; email: string }, c: { reference: string }, supervisorName: string, reason: string, caseLink: string): OutgoingMail {
  return composeMail(to.email, `[${c.reference}] Finding sent back for more work`, [
    `Hello ${to.name},`,
    `${supervisorName} has sent your finding on ${c.reference} back for more work:`,
    reason,
    'The case is in your queue again:',
    caseLink,
  ])
}
