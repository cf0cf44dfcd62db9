/**
 * Retention and legal hold: how long a closed case keeps its complainant's personal data, and
 * what the retention run records. Lists here are the columns' CHECKs (server/db/schema/retention.ts).
 */

/** Months a closed case keeps its complainant's personal data by default (common practice, no source). */
export const DEFAULT_RETENTION_MONTHS = 24
/** The longest period an office may set (100 years). */
export const MAX_RETENTION_MONTHS = 1200

/** What the retention run does to a case, each recorded once in retention_actions. */
export const RETENTION_ACTIONS = ['personal_data_erased', 'evidence_disposed'] as const
export type RetentionAction = (typeof RETENTION_ACTIONS)[number]

/** A legal hold's history: set (with a reason and an optional last day) and lifted (with a reason). */
export const LEGAL_HOLD_ACTIONS = ['set', 'lifted'] as const
export type LegalHoldAction = (typeof LEGAL_HOLD_ACTIONS)[number]

/** The case fields the retention run erases (complainant's identity and contact, and the free text they wrote). */
export const ERASED_CASE_FIELDS = ['complainantName', 'complainantEmail', 'complainantPhone', 'complainantOrganisation', 'description', 'patternDetail'] as const
export type ErasedCaseField = (typeof ERASED_CASE_FIELDS)[number]

/** What replaces a complainant's name and contact details. */
export function erasureMarker(at: Date): string {
  return `erased on ${at.toISOString().slice(0, 10)}`
}

/**
 * The redacted copy of text a complainant wrote: e-mail addresses, web addresses, phone-like
 * numbers (7 or more digits, with spaces, dots, dashes, brackets or a leading +; not ISO dates) and the words
 * of the complainant's own name are masked; the rest (what they heard, when, on which
 * frequency) stays, because the case's technical record still needs it.
 */
export function redactComplainantText(text: string, identity: { name?: string | null; email?: string | null; phone?: string | null; organisation?: string | null }): string {
  let out = text
    .replace(/[\w.+-]+@[\w-]+(?:\.[\w-]+)+/g, '[e-mail removed]')
    .replace(/\b(?:https?:\/\/|www\.)\S*[^\s.,;:!?)]/gi, '[address removed]')
    // ISO dates (2026-11-20) are facts of the case, not phone numbers
    .replace(/\+?\(?\d[\d\s().-]{5,}\d/g, (m) => (m.replace(/\D/g, '').length >= 7 && !/^\d{4}-\d{2}-\d{2}$/.test(m) ? '[number removed]' : m))
  const words = [identity.name, identity.organisation]
    .flatMap((s) => (s ?? '').split(/\s+/))
    .map((w) => w.replace(/[^\p{L}\p{N}'-]/gu, ''))
    .filter((w) => w.length >= 2)
  for (const w of words) out = out.replace(new RegExp(`(?<![\\p{L}\\p{N}])${escapeRegExp(w)}(?![\\p{L}\\p{N}])`, 'giu'), '[name removed]')
  if (identity.email) out = out.split(identity.email).join('[e-mail removed]')
  if (identity.phone) out = out.split(identity.phone).join('[number removed]')
  return out
}

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
}

/** The day a closed case's retention ends: closing time plus the office's months (calendar months, UTC). */
export function retentionEndsAt(closedAt: Date, months: number): Date {
  const d = new Date(closedAt.getTime())
  const day = d.getUTCDate()
  d.setUTCDate(1)
  d.setUTCMonth(d.getUTCMonth() + months)
  const lastDay = new Date(Date.UTC(d.getUTCFullYear(), d.getUTCMonth() + 1, 0)).getUTCDate()
  d.setUTCDate(Math.min(day, lastDay))
  return d
}

/**
 * The fewest whole months after closing that still keep a case until the end of the day a
 * follow-up is due (`dueOn`, YYYY-MM-DD, taken as the end of that day in UTC).
 */
export function monthsNeededFor(closedAt: Date, dueOn: string): number {
  const dueEnd = new Date(`${dueOn}T23:59:59.999Z`)
  let months = 0
  while (retentionEndsAt(closedAt, months) <= dueEnd && months <= MAX_RETENTION_MONTHS) months++
  return months
}
