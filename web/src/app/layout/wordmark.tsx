/** Quietband's mark: a trace that rises once and settles flat — interference, then quiet. */
import { Link } from 'react-router-dom'
import { paths } from '@/lib/paths'

export function Wordmark() {
  return (
    <Link to={paths.home.href()} className="flex items-center gap-2 text-paper no-underline hover:text-paper" aria-label="Quietband home">
      <svg aria-hidden="true" width="28" height="28" viewBox="0 0 32 32">
        <rect width="32" height="32" rx="7" fill="currentColor" opacity="0.12" />
        <path d="M4 16c2.5-9 5-9 7.5 0s4 4.5 6 0 3 0 4 0h6.5" fill="none" stroke="currentColor" strokeWidth="2.6" strokeLinecap="round" />
      </svg>
      <span className="text-xl font-bold tracking-tight">Quietband</span>
    </Link>
  )
}
