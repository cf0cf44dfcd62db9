/**
 * Retention and legal hold: how long a closed case keeps its complainant's personal data, and
 * what the retention run records. Lists here are the columns' CHECKs (server/db/schema/retention.ts).
 */

/** Months a closed case keeps its complainant's personal data by default (common practice, no source). */
export const DEFAULT_RETENTION_MONTHS = 24
/** The longest period an office may set (100 years). */
export const MAX_RETENTION_MONTHS = 1200

/**
 * What the retention run does to a case, each recorded in retention_actions: the erasure of the
 * case's personal data; the redaction of other cases' merge entries that quote its complainant;
 * the rounding of its position; the erasure of its evidence files' names; the cancelling of
 * unsent e-mails to its complainant; the deactivation of its complainant's account; and each
 * object deleted from the store (an evidence file or its thumbnail), recorded twice: 'pending'
 * when the decision commits, 'done' once the object is gone.
 */
export const RETENTION_ACTIONS = [
  'personal_data_erased',
  'evidence_disposed',
  'thumbnail_disposed',
  'merge_entries_redacted',
  'location_coarsened',
  'file_names_erased',
  'queued_mail_cancelled',
  'account_deactivated',
] as const
export type RetentionAction = (typeof RETENTION_ACTIONS)[number]

/** What a retention_actions row of the kinds without columns of their own records. */
export type RetentionActionDetails =
  /** location_coarsened: the step the position was rounded to. */
  | { positionStepDeg: number }
  /** file_names_erased: each evidence file's stored file and the name it now has. */
  | { files: { evidenceId: string; storedFileId: string; name: string }[] }
  /** queued_mail_cancelled: how many unsent e-mails to the complainant were cancelled and deleted, and their job ids. */
  | { count: number; jobIds: string[] }
  /** account_deactivated: the complainant's account and how many of its sessions were ended. */
  | { userId: string; sessionsEnded: number }

/** The actions that delete an object from the store, recorded 'pending' then 'done'. */
export const DISPOSAL_ACTIONS = ['evidence_disposed', 'thumbnail_disposed'] as const satisfies readonly RetentionAction[]
export type DisposalAction = (typeof DISPOSAL_ACTIONS)[number]
export const DISPOSAL_STAGES = ['pending', 'done'] as const
export type DisposalStage = (typeof DISPOSAL_STAGES)[number]

/**
 * The precision a case's position keeps after erasure: 0.01° (about 1.1 km of latitude, less of
 * longitude away from the equator) — enough for statistics and the office's maps, too coarse to
 * point at one house (common practice, no source).
 */
export const ERASED_POSITION_STEP_DEG = 0.01

/** A coordinate rounded to ERASED_POSITION_STEP_DEG. */
export function coarsenDeg(deg: number): number {
  const rounded = Math.round(deg / ERASED_POSITION_STEP_DEG) / Math.round(1 / ERASED_POSITION_STEP_DEG)
  return rounded === 0 ? 0 : rounded // never -0
}

/** File-name extensions kept in an erased file's name (a type, never a word a person chose). */
const KEPT_EXTENSIONS = new Set([
  'bin', 'cf32', 'cs16', 'cs8', 'csv', 'cu8', 'dat', 'doc', 'docx', 'gif', 'heic', 'iq', 'jpeg', 'jpg', 'json', 'kml', 'kmz', 'm4a', 'mov', 'mp3', 'mp4',
  'ods', 'odt', 'pdf', 'png', 'raw', 'sigmf-data', 'sigmf-meta', 'tif', 'tiff', 'txt', 'wav', 'webp', 'xls', 'xlsx', 'xml', 'zip',
])

/**
 * The name an evidence file keeps once its case's personal data is erased: `erased-<first 12
 * hex digits of its SHA-256>` and the original extension when it is a known file type (the
 * database function checks this shape).
 */
export function erasedFileName(originalName: string, sha256: string): string {
  const dot = originalName.lastIndexOf('.')
  const ext = dot > 0 ? originalName.slice(dot + 1).toLowerCase() : ''
  return `erased-${sha256.slice(0, 12)}${KEPT_EXTENSIONS.has(ext) ? `.${ext}` : ''}`
}

/** A legal hold's history: set (with a reason and an optional last day) and lifted (with a reason). */
export const LEGAL_HOLD_ACTIONS = ['set', 'lifted'] as const
export type LegalHoldAction = (typeof LEGAL_HOLD_ACTIONS)[number]

/** The case fields the retention run erases (complainant's identity and contact, and the free text they wrote). */
export const ERASED_CASE_FIELDS = ['complainantName', 'complainantEmail', 'complainantPhone', 'complainantOrganisation', 'address', 'description', 'patternDetail'] as const
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
export function redactComplainantText(
  text: string,
  identity: { name?: string | null; email?: string | null; phone?: string | null; organisation?: string | null; address?: string | null },
): string {
  // the case's address as the complainant wrote it, before its words could be taken apart below
  let out = (identity.address ? text.split(identity.address).join('[address removed]') : text)
    .replace(/[\w.+-]+@[\w-]+(?:\.[\w-]+)+/g, '[e-mail removed]')
    .replace(/\b(?:https?:\/\/|www\.)\S*[^\s.,;:!?)]/gi, '[address removed]')
    // ISO dates (2026-11-20) are facts of the case, not phone numbers; nor is a case reference
    // (QB-26-000123): a number never starts inside another number or right after two or three capitals and "-"
    .replace(/(?<!\p{N}|\b\p{Lu}{2,3}-)\+?\(?\d[\d\s().-]{5,}\d/gu, (m) => (m.replace(/\D/g, '').length >= 7 && !/^\d{4}-\d{2}-\d{2}$/.test(m) ? '[number removed]' : m))
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
