/**
 * A list of rows in the form state (`<path>.<i>.…`, the count in `<path>#rows`): add, remove
 * (later rows move up), and the rows' inputs read back in order.
 */
import type { ReactNode } from 'react'
import { Button } from '@/components/ui/button'
import { withoutBranch, type FormState } from '../lib/form-state'
import { useEstimateForm, FIELD_GRID } from './form-controls'

export const rowCount = (state: FormState, path: string) => Number(state[`${path}#rows`] ?? '0') || 0

/** Each row's inputs, or undefined when there are none. */
export function rowsInputs<T>(state: FormState, path: string, read: (rowPath: string) => T): T[] | undefined {
  const n = rowCount(state, path)
  return n === 0 ? undefined : Array.from({ length: n }, (_, i) => read(`${path}.${i}`))
}

export function removeRow(state: FormState, path: string, i: number): FormState {
  const n = rowCount(state, path)
  let next = withoutBranch(state, `${path}.${i}`)
  for (let j = i + 1; j < n; j++) {
    const from = `${path}.${j}.`
    const to = `${path}.${j - 1}.`
    next = Object.fromEntries(Object.entries(next).map(([k, v]) => [k.startsWith(from) ? to + k.slice(from.length) : k, v]))
  }
  return { ...next, [`${path}#rows`]: String(n - 1) }
}

export function RowsEditor(props: { path: string; title: string; empty: string; addLabel: string; rowName: string; newRow?: (rowPath: string) => FormState; children: (rowPath: string, index: number) => ReactNode }) {
  const { state, onChange } = useEstimateForm()
  const n = rowCount(state, props.path)
  return (
    <div className="flex min-w-0 flex-col gap-3 md:col-span-2">
      <p className="font-semibold">{props.title}</p>
      {n === 0 && <p className="text-sm text-ink-muted">{props.empty}</p>}
      <ol className="flex flex-col gap-3">
        {Array.from({ length: n }, (_, i) => (
          <li key={i} className="flex min-w-0 flex-col gap-3 rounded-control border border-rule p-3">
            <div className={FIELD_GRID}>{props.children(`${props.path}.${i}`, i)}</div>
            <div>
              <Button variant="quiet" onClick={() => onChange(removeRow(state, props.path, i))}>
                Remove {props.rowName} {i + 1}
              </Button>
            </div>
          </li>
        ))}
      </ol>
      <div>
        <Button variant="secondary" onClick={() => onChange({ ...state, [`${props.path}#rows`]: String(n + 1), ...(props.newRow?.(`${props.path}.${n}`) ?? {}) })}>
          {props.addLabel}
        </Button>
      </div>
    </div>
  )
}
