/**
 * What the audit log records: administrative changes, exports and sensitive reads. Each action
 * is `<subject>.<verb>`; the list is the column's CHECK (server/db/schema/audit.ts), so a new
 * action is a new entry here and a migration.
 */
export const AUDIT_ACTIONS = [
  'user.invited',
  'user.deactivated',
  'user.reactivated',
  'user.role_changed',
  'user.office_changed',
  'office.created',
  'office.updated',
  'office.area_changed',
  'office.response_targets_changed',
  'office.first_response_targets_changed',
  'office.time_zone_changed',
  'band_limit.edited',
  'station_register.imported',
  'equipment.changed',
  'cases.exported_csv',
  'evidence.bundle_exported',
  'case_file.issued',
  'tracking_links.revoked',
  'complainant_details.viewed',
  'legal_hold.set',
  'legal_hold.lifted',
  'retention.changed',
  'retention.run',
  'audit.exported_csv',
] as const
export type AuditAction = (typeof AUDIT_ACTIONS)[number]

/** Plain-language names for the audit list. */
export const AUDIT_ACTION_LABELS: Record<AuditAction, string> = {
  'user.invited': 'Person invited',
  'user.deactivated': 'Person deactivated',
  'user.reactivated': 'Person reactivated',
  'user.role_changed': 'Role changed',
  'user.office_changed': 'Office changed',
  'office.created': 'Office created',
  'office.updated': 'Office details changed',
  'office.area_changed': 'Office area changed',
  'office.response_targets_changed': 'Resolution targets changed',
  'office.first_response_targets_changed': 'First-response targets changed',
  'office.time_zone_changed': 'Office time zone changed',
  'band_limit.edited': 'Band limit edited',
  'station_register.imported': 'Station register imported',
  'equipment.changed': 'Equipment added or changed',
  'cases.exported_csv': 'Case list exported (CSV)',
  'evidence.bundle_exported': 'Evidence bundle exported',
  'case_file.issued': 'Case file issued',
  'tracking_links.revoked': 'Tracking links revoked',
  'complainant_details.viewed': "Complainant's personal details opened",
  'legal_hold.set': 'Legal hold set',
  'legal_hold.lifted': 'Legal hold lifted',
  'retention.changed': 'Retention period changed',
  'retention.run': 'Retention run',
  'audit.exported_csv': 'Audit list exported (CSV)',
}

/**
 * A member of staff opening a complainant's personal details is recorded at most once per
 * person and case in this window, so reading a case many times does not flood the log.
 */
export const COMPLAINANT_VIEW_AUDIT_WINDOW_MS = 60 * 60 * 1000
