/**
 * Saved views of the case list: a person's own named list queries. The query is the list
 * page's search string (filters and sort, as the page writes it), kept as text: the list reads
 * it back with its own parser, so a view saved before a filter changed still opens.
 */
import { z } from 'zod'

export const SAVED_VIEW_NAME_MAX = 80
export const SAVED_VIEWS_PER_PERSON_MAX = 30

export const savedViewInputSchema = z.object({
  name: z
    .string({ message: 'Give the view a name.' })
    .trim()
    .min(1, 'Give the view a name.')
    .max(SAVED_VIEW_NAME_MAX, `A view's name has at most ${SAVED_VIEW_NAME_MAX} characters.`)
    .refine((s) => ![...s].some((ch) => ch.charCodeAt(0) < 32 || ch.charCodeAt(0) === 127), 'A view’s name cannot hold control characters.'),
  listQuery: z
    .string({ message: 'The view has no list query.' })
    .max(2000, 'This view’s filters are too long to save.')
    .refine((s) => s === '' || /^[A-Za-z]+=[^&]*(&[A-Za-z]+=[^&]*)*$/.test(s), 'The list query must be the list page’s own search string (name=value pairs).'),
})
export type SavedViewInput = z.infer<typeof savedViewInputSchema>

export const savedViewSchema = z.object({
  id: z.uuid(),
  name: z.string(),
  listQuery: z.string(),
  createdAt: z.iso.datetime({ offset: true }),
})
export type SavedViewView = z.infer<typeof savedViewSchema>

export const savedViewsResponseSchema = z.object({ views: z.array(savedViewSchema) })
export const savedViewResponseSchema = z.object({ view: savedViewSchema })
