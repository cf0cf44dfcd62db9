/**
 * The person's saved views of the case list: each a link to the list with its filters, one
 * removable with a button; "Save this view" names the list as it is now (its URL query).
 */
import { useState, type FormEvent } from 'react'
import { Link } from 'react-router-dom'
import { Button } from '@/components/ui/button'
import { TextField } from '@/components/ui/text-field'
import { isApiError } from '@/lib/api-client'
import { paths } from '@/lib/paths'
import { useRemoveView, useSaveView, useSavedViews } from '../api/saved-views'

export function SavedViews({ listQuery }: { listQuery: string }) {
  const views = useSavedViews()
  const save = useSaveView()
  const remove = useRemoveView()
  const [name, setName] = useState('')
  const [error, setError] = useState<string | undefined>()
  const [saved, setSaved] = useState<string | null>(null)

  const onSubmit = (e: FormEvent) => {
    e.preventDefault()
    setSaved(null)
    if (!name.trim()) return setError('Give the view a name.')
    save.mutate(
      { name: name.trim(), listQuery },
      {
        onSuccess: (v) => {
          setError(undefined)
          setName('')
          setSaved(v.name)
        },
        onError: (err) => setError(isApiError(err) ? [err.message, ...err.details.map((d) => d.message)].join(' ') : 'The view could not be saved.'),
      },
    )
  }

  return (
    <section aria-labelledby="saved-views-title" className="flex flex-col gap-2 rounded-panel border border-rule bg-surface p-3">
      <h2 id="saved-views-title" className="font-bold">
        Your saved views
      </h2>
      {views.data && views.data.length === 0 && <p className="text-sm text-ink-muted">None yet. Filter the list, then save it here under a name.</p>}
      {views.data && views.data.length > 0 && (
        <ul className="flex flex-wrap gap-2">
          {views.data.map((v) => (
            <li key={v.id} className="flex items-center gap-1 rounded-control border border-field pl-3">
              <Link to={`${paths.cases.path}${v.listQuery ? `?${v.listQuery}` : ''}`} className="text-sm font-semibold">
                {v.name}
              </Link>
              <button type="button" onClick={() => remove.mutate(v.id)} disabled={remove.isPending} className="min-h-11 min-w-11 px-2 text-ink-muted hover:text-danger" aria-label={`Remove the view ${v.name}`}>
                <span aria-hidden="true">×</span>
              </button>
            </li>
          ))}
        </ul>
      )}
      <form onSubmit={onSubmit} noValidate aria-label="Save this view" className="flex flex-col gap-2 sm:flex-row sm:items-end">
        <div className="sm:w-72">
          <TextField label="Name of this view" name="saved-view-name" value={name} onChange={(e) => setName(e.target.value)} error={error} maxLength={80} />
        </div>
        <Button type="submit" variant="secondary" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : 'Save this view'}
        </Button>
      </form>
      {saved && (
        <p role="status" className="text-sm font-semibold text-ok">
          Saved as “{saved}”.
        </p>
      )}
    </section>
  )
}
