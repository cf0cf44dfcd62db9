/**
 * A dashboard figure's link to the case list: the figure's filters (shared/domain/dashboard-figures.ts,
 * in the list API's spelling) read as the list reads its own address, then written by paths.
 */
import type { FigureFilters } from '@shared/domain/dashboard-figures'
import { parseListState } from './case-list-query'
import { paths } from './paths'

export function figureHref(filters: FigureFilters): string {
  return paths.cases.href(parseListState(new URLSearchParams(filters)))
}
