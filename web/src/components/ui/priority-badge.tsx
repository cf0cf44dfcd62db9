/**
 * Case priority, shown as colour + shape + words so it reads in sunlight, in greyscale print
 * and for colour-blind readers alike. The more urgent, the more points the shape has to it:
 * P1 a solid diamond, P2 a solid triangle, P3 an open square, P4 an open circle.
 */
import { PRIORITY_LABELS, type Priority } from '@shared/domain/services'

const COLOUR: Record<Priority, string> = {
  1: 'text-priority-1 border-priority-1',
  2: 'text-priority-2 border-priority-2',
  3: 'text-priority-3 border-priority-3',
  4: 'text-priority-4 border-priority-4',
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

/** Compact badge: shape, "P1" in figures type, and the short label. */
export function PriorityBadge({ level }: { level: Priority }) {
  return (
    <span
      title={PRIORITY_LABELS[level].long}
      className={`inline-flex items-center gap-1.5 rounded-sm border bg-surface px-2 py-0.5 text-sm font-semibold ${COLOUR[level]}`}
    >
      <PriorityShape level={level} />
      <span className="font-mono">P{level}</span>
      <span className="text-ink">{PRIORITY_LABELS[level].short}</span>
    </span>
  )
}
