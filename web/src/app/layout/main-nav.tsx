/** The main navigation; its links depend on who is signed in (GET /api/me). */
import { NavLink } from 'react-router-dom'
import type { AccountAbilities } from '@shared/schemas/auth'
import { navItemsFor } from './nav-items'

export function MainNav({ abilities, pending }: { abilities: AccountAbilities | null; pending: boolean }) {
  // While we do not yet know who this is, show no links rather than the wrong ones.
  const items = pending ? [] : navItemsFor(abilities)
  return (
    <nav aria-label="Main" aria-busy={pending || undefined}>
      <ul className="flex flex-wrap gap-1">
        {items.map((item) => (
          <li key={item.label}>
            <NavLink
              to={item.to}
              className={({ isActive }) =>
                `flex min-h-11 items-center rounded-control px-3 font-semibold no-underline ${
                  isActive ? 'bg-paper text-ink hover:text-ink' : 'text-paper hover:bg-paper/15 hover:text-paper'
                }`
              }
            >
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  )
}
