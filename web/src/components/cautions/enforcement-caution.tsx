import { ENFORCEMENT_CAUTION } from '@shared/domain/cautions'

/**
 * The caution shown wherever a finding is read: a finding that rests on an estimate supports,
 * and does not replace, the regulator's procedure; enforcement follows local codes and
 * licensed practice.
 */
export { ENFORCEMENT_CAUTION }

export function EnforcementCaution() {
  return (
    <aside aria-label="Enforcement caution" className="rounded-control border-l-4 border-caution bg-caution-soft px-4 py-3 text-sm text-ink">
      <p className="font-semibold">Before acting on this finding</p>
      <p className="mt-1">{ENFORCEMENT_CAUTION}</p>
    </aside>
  )
}
