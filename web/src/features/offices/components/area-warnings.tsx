/** The area's warnings (overlaps with other offices' areas, a position outside the area) in the server's words. */
import type { AreaWarning } from '@shared/schemas/offices'
import { Notice } from '@/components/ui/notice'

export function AreaWarnings({ warnings, title }: { warnings: AreaWarning[]; title: string }) {
  if (warnings.length === 0) return null
  return (
    <Notice tone="caution" title={title}>
      <ul className="flex list-disc flex-col gap-1 pl-5 [overflow-wrap:anywhere]">
        {warnings.map((w, i) => (
          <li key={`${w.code}-${w.otherOfficeId ?? i}`}>{w.message}</li>
        ))}
      </ul>
    </Notice>
  )
}
