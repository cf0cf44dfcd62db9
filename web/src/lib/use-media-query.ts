/**
 * Whether a CSS media query matches, kept current as the window changes. Where the browser has
 * no matchMedia (the component tests' DOM), `fallback` stands in.
 */
import { useSyncExternalStore } from 'react'

export function useMediaQuery(query: string, fallback: boolean): boolean {
  return useSyncExternalStore(
    (onChange) => {
      if (typeof window === 'undefined' || !window.matchMedia) return () => {}
      const list = window.matchMedia(query)
      list.addEventListener('change', onChange)
      return () => list.removeEventListener('change', onChange)
    },
    () => (typeof window !== 'undefined' && window.matchMedia ? window.matchMedia(query).matches : fallback),
    () => fallback,
  )
}

/** Lists are tables from 640 px up (Tailwind's `sm`), cards below. */
export const useTableWidth = () => useMediaQuery('(min-width: 640px)', true)
