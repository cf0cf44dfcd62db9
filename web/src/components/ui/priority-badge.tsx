/**
 * A case's harm class (its priority), shown as weight + shape + name so it reads in sunlight,
 * in greyscale print and for colour-blind readers alike. The greater the harm, the heavier the
 * mark: safety of life is a filled plate with a solid diamond, service lost a heavy outline with
 * a solid triangle, service degraded a thin outline with an open square, a nuisance a dashed
 * outline with an open circle. The figure 1–4 stays in the data, never on the badge.
 */
import { PRIORITY_LABELS, type Priority } from '@shared/domain/services'

const PLATE: Record<Priority, string> = {
  1: 'border-2 border-priority-1 bg-priority-1 text-surface',
  2: 'border-2 border-priority-2 bg-surface text-priority-2',
  3: 'border border-priority-3 bg-surface text-priority-3',
  4: 'border border-dashed border-priority-4 bg-surface text-priority-4',
}

export function PriorityShape({ level, sizePx = 14 }: { level: Priority; sizePx?: number }) {
  return (
    <svg aria-hidden="true" width={sizePx} height={sizePx} viewBox="0 0 16 16" className="shrink-0">
      {level === 1 && <path d="M8 0.5 15.5 8 8 15.5 0.5 8Z" fill="currentColor" />}
      {level === 2 && <path d="M8 1 15.5 14.5H0.5Z" fill="currentColor" />}
      {level === 3 && <rect x="2" y="2" width="12" height="12" fill="none" stroke="currentColor" strokeWidth="3" />}
      {level === 4 && <circle cx="8" cy="8" r="5.5" fill="none" stroke="currentColor" strokeWidth="2.5" />}
    </svg>
  )
}

/** Compact badge: the class's shape and name on a plate as heavy as the harm. */
export function PriorityBadge({ level }: { level: Priority }) {
  return (
    <span title={`Harm class ${level}: ${PRIORITY_LABELS[level].long}`} className={`inline-flex items-center gap-1.5 rounded-sm px-2 py-0.5 text-sm font-semibold whitespace-nowrap ${PLATE[level]}`}>
      <PriorityShape level={level} />
      <span>{PRIORITY_LABELS[level].short}</span>
    </span>
  )
}
