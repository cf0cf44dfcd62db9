/**
 * Helpers for case tests: a valid report, filing it, and reading queued e-mail. The office,
 * people and cases a test owns come from tests/support/factories.ts.
 */
import request from 'supertest'
import type pg from 'pg'
import { expect } from 'vitest'
import type { TestContext } from './harness'
import { uniqueAddress } from './harness'
import type { ReportInput } from '../../shared/schemas/cases'

/** Near the Harrowmere office of the demo region (48.12 N, 31.40 W). */
export const NEAR_HARROWMERE = { latDeg: 48.1, lonDeg: -31.35 }
/** Near the Kestrel Bay office (47.62 N, 30.55 W). */
export const NEAR_KESTREL_BAY = { latDeg: 47.65, lonDeg: -30.6 }

let n = 0
export function validReport(over: Partial<ReportInput> = {}): ReportInput {
  n += 1
  return {
    name: 'Ines Marlow',
    email: `reporter-${process.pid}-${n}-${Date.now()}@example.test`,
    service: 'mobile_network',
    frequencyFrom: 1710,
    frequencyTo: 1785,
    frequencyUnit: 'MHz',
    address: '14 Quarry Lane, Harrowmere',
    ...NEAR_HARROWMERE,
    since: '2026-11-20',
    pattern: 'continuous',
    experience: 'outage',
    description: 'No mobile signal at home since the neighbour installed a box in the loft.',
    ...over,
  }
}

export interface Filed {
  id: string
  reference: string
  trackingToken: string
  email: string
}

/** Files a report as the public and returns the case id and its tracking token. */
export async function fileReport(t: TestContext, over: Partial<ReportInput> = {}): Promise<Filed> {
  const report = validReport(over)
  const res = await request(t.app).post('/api/reports').set('X-Forwarded-For', uniqueAddress()).send(report)
  expect(res.status, JSON.stringify(res.body)).toBe(201)
  const token = /\/track\/([A-Za-z0-9_-]+)$/.exec(res.body.trackingUrl)![1]!
  const { rows } = await t.pool.query(`SELECT id FROM cases WHERE reference = $1`, [res.body.reference])
  return { id: rows[0].id, reference: res.body.reference, trackingToken: token, email: report.email }
}

/** The queued e-mails to an address, oldest first (mail jobs are pg-boss rows). */
export async function queuedMails(pool: pg.Pool, to: string): Promise<{ subject: string; text: string }[]> {
  const { rows } = await pool.query(`SELECT data FROM pgboss.job WHERE name LIKE 'mail-send%' AND data->>'to' = $1 ORDER BY created_on, id`, [to])
  return rows.map((r) => r.data)
}

export async function caseVersion(pool: pg.Pool, id: string): Promise<number> {
  const { rows } = await pool.query(`SELECT version FROM cases WHERE id = $1`, [id])
  return rows[0].version
}
