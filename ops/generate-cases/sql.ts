/**
 * The generator's SQL: offices and staff read back, synthetic investigators added, and
 * multi-row INSERT … SELECT FROM unnest($1::type[], …) statements whose column names and
 * types are read from the drizzle schema (server/db/schema), so they follow its changes.
 */
import type pg from 'pg'
import { caseEvents, cases } from '../../server/db/schema'
import type { Draw } from './draw'
import { GENERATED_CASE_COLUMNS, GENERATED_EVENT_COLUMNS, type GeneratedCase, type Office } from './make-case'
import { FIRST, LAST } from './tables'

export async function loadOffices(client: pg.ClientBase): Promise<Office[]> {
  const { rows } = await client.query(`SELECT id, name, centre_lat_deg, centre_lon_deg, target_p1_hours, target_p2_hours, target_p3_hours, target_p4_hours, first_response_p1_hours, first_response_p2_hours, first_response_p3_hours, first_response_p4_hours FROM offices ORDER BY name`)
  const staff = await client.query(`SELECT id, name, role, office_id FROM users WHERE role IN ('investigator','supervisor') AND active ORDER BY email`)
  return rows.map((o) => ({
    id: o.id,
    name: o.name,
    centreLatDeg: o.centre_lat_deg,
    centreLonDeg: o.centre_lon_deg,
    targetsHours: { 1: o.target_p1_hours, 2: o.target_p2_hours, 3: o.target_p3_hours, 4: o.target_p4_hours },
    firstResponseHours: { 1: o.first_response_p1_hours, 2: o.first_response_p2_hours, 3: o.first_response_p3_hours, 4: o.first_response_p4_hours },
    investigators: staff.rows.filter((u) => u.office_id === o.id && u.role === 'investigator').map((u) => ({ id: u.id, name: u.name })),
    supervisor: staff.rows.find((u) => u.office_id === o.id && u.role === 'supervisor') ?? null,
  }))
}

/** Adds synthetic investigators (no password, so they cannot sign in) up to `perOffice`. */
export async function topUpInvestigators(client: pg.ClientBase, offices: Office[], perOffice: number, d: Draw): Promise<number> {
  let added = 0
  for (const o of offices) {
    const slug = o.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')
    for (let i = o.investigators.length; i < perOffice; i++) {
      const name = `${d.pick(FIRST)} ${d.pick(LAST)}`
      const { rows } = await client.query(
        `INSERT INTO users (email, name, role, office_id) VALUES ($1, $2, 'investigator', $3)
         ON CONFLICT (email) DO UPDATE SET email = excluded.email RETURNING id`,
        [`synthetic-${slug}-${i + 1}@staff.quietband.test`, name, o.id],
      )
      o.investigators.push({ id: rows[0].id, name })
      added++
    }
  }
  return added
}

interface SchemaColumn {
  name: string
  getSQLType(): string
}

/** `INSERT INTO table (cols) SELECT … FROM unnest($1::type[], …)` for the given schema columns. */
function unnestInsert(table: string, columns: readonly SchemaColumn[], select?: (names: string[]) => { extraColumns: string; extraValues: string }): string {
  const names = columns.map((c) => c.name)
  const unnest = `unnest(${columns.map((c, i) => `$${i + 1}::${c.getSQLType()}[]`).join(', ')}) AS r(${names.join(', ')})`
  const extra = select?.(names)
  if (!extra) return `INSERT INTO ${table} (${names.join(', ')}) SELECT ${names.map((n) => `r.${n}`).join(', ')} FROM ${unnest}`
  return `INSERT INTO ${table} (${extra.extraColumns}, ${names.join(', ')}) SELECT ${extra.extraValues}, ${names.map((n) => `r.${n}`).join(', ')} FROM ${unnest}`
}

const CASE_SCHEMA_COLUMNS: SchemaColumn[] = GENERATED_CASE_COLUMNS.map((k) => cases[k])
const EVENT_SCHEMA_COLUMNS: SchemaColumn[] = GENERATED_EVENT_COLUMNS.map((k) => caseEvents[k])

/** Cases with a reference from the shared sequence (QB-YY-000123) and updated_at at their last move. */
export const CASE_INSERT = unnestInsert('cases', CASE_SCHEMA_COLUMNS, () => ({
  extraColumns: 'reference, updated_at',
  extraValues: `'QB-' || to_char(r.received_at AT TIME ZONE 'UTC', 'YY') || '-' || lpad(nextval('case_reference_seq')::text, 6, '0'), coalesce(r.closed_at, r.received_at)`,
}))

export const EVENT_INSERT = unnestInsert('case_events', EVENT_SCHEMA_COLUMNS)

/** A value as node-postgres sends it inside an array parameter. */
function toParam(v: unknown): unknown {
  return v instanceof Date ? v.toISOString() : (v ?? null)
}

/** One array per case column, in GENERATED_CASE_COLUMNS order. */
export function caseParams(batch: readonly GeneratedCase[]): unknown[][] {
  return GENERATED_CASE_COLUMNS.map((k) => batch.map((c) => toParam(c[k])))
}

/** One array per event column, every event of every case in the batch. */
export function eventParams(batch: readonly GeneratedCase[]): unknown[][] {
  return GENERATED_EVENT_COLUMNS.map((k) => batch.flatMap((c) => c.events.map((e) => toParam(k === 'caseId' ? c.id : e[k]))))
}
