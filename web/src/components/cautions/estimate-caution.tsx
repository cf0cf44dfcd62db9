import { CAUTION_LINES } from '@shared/domain/cautions'
import { Sign } from '../ui/sign'

/**
 * The product's standing caution. The footer shows it on every page; result screens show the
 * inline form beside their numbers.
 */
export { CAUTION_LINES }

export function EstimateCaution({ variant = 'inline' }: { variant?: 'inline' | 'footer' }) {
  if (variant === 'footer') {
    return (
      <section aria-label="Caution" className="flex gap-3 text-sm leading-relaxed">
        <span className="text-caution">
          <Sign kind="caution" />
        </span>
        <p>{CAUTION_LINES.join(' ')}</p>
      </section>
    )
  }
  return (
    <aside aria-label="Caution" className="rounded-control border-l-4 border-caution bg-caution-soft px-4 py-3 text-sm text-ink">
      <p className="font-semibold">Read results with care</p>
      <ul className="mt-1 list-disc pl-5">
        {CAUTION_LINES.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
    </aside>
  )
}
