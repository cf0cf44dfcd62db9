/**
 * Saved views of the case list: staff keep their own named filters. Nobody sees or removes
 * another person's views (another person's id is simply not found).
 */
import type { ServiceContext } from '../../context'
import { conflict, notFound } from '../../http/errors'
import type { Actor } from '../../policy/policy'
import { SAVED_VIEWS_PER_PERSON_MAX, type SavedViewInput, type SavedViewView } from '../../../shared/schemas/saved-views'
import type { SavedView } from '../../db/schema'
import { countSavedViews, deleteSavedView, insertSavedView, listSavedViews } from './saved-views.repo'

const present = (v: SavedView): SavedViewView => ({ id: v.id, name: v.name, listQuery: v.listQuery, createdAt: v.createdAt.toISOString() })

export async function savedViewsOf(ctx: ServiceContext, actor: Actor): Promise<SavedViewView[]> {
  return (await listSavedViews(ctx.db, actor.id)).map(present)
}

export async function saveView(ctx: ServiceContext, actor: Actor, input: SavedViewInput): Promise<SavedViewView> {
  if ((await countSavedViews(ctx.db, actor.id)) >= SAVED_VIEWS_PER_PERSON_MAX) {
    throw conflict('too_many_views', `You have ${SAVED_VIEWS_PER_PERSON_MAX} saved views, the most one person keeps. Remove one first.`)
  }
  const v = await insertSavedView(ctx.db, { userId: actor.id, name: input.name, listQuery: input.listQuery })
  if (!v) throw conflict('view_name_taken', `You already have a view called “${input.name}”. Choose another name, or remove that one first.`)
  return present(v)
}

export async function removeView(ctx: ServiceContext, actor: Actor, id: string): Promise<void> {
  if (!(await deleteSavedView(ctx.db, actor.id, id))) throw notFound('view_not_found', 'You have no saved view with this id.')
}
