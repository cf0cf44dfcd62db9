/** Service names: the full label for forms and the case page, the short one for tables. */
import { SERVICE_LABELS, type AffectedService } from '@shared/domain/services'

export function serviceLabel(service: string): string {
  return SERVICE_LABELS[service as AffectedService] ?? service
}

/** "Maritime (ship and coast radio, …)" → "Maritime". */
export function serviceShortLabel(service: string): string {
  return serviceLabel(service).replace(/\s*\(.*\)$/, '')
}
