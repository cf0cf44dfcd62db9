/**
 * The synthetic-case generator without a database: its cases walk the case lifecycle, and its
 * command line reads and refuses options clearly. (A run against a database is described in
 * ops/bench/README.md.)
 */
import { describe, expect, it } from 'vitest'
import { CASE_MOVES, CASE_STATES, RESOLUTIONS, type CaseMoveName } from '../../shared/domain/case-lifecycle'
import { commandLine } from '../../ops/generate-cases'
import { Draw } from '../../ops/generate-cases/draw'
import { walkTo } from '../../ops/generate-cases/lifecycle-walk'
import { DAY_MS, makeCase, type Office } from '../../ops/generate-cases/make-case'

const offices: Office[] = [
  {
    id: '00000000-0000-4000-8000-000000000001',
    name: 'North office',
    centreLatDeg: 48.2,
    centreLonDeg: -31.3,
    targetsHours: { 1: 4, 2: 24, 3: 72, 4: 240 },
    firstResponseHours: { 1: 1, 2: 8, 3: 24, 4: 72 },
    investigators: [{ id: '00000000-0000-4000-8000-0000000000a1', name: 'Ada Ashcombe' }],
    supervisor: { id: '00000000-0000-4000-8000-0000000000b1', name: 'Bram Brannagh' },
  },
  {
    id: '00000000-0000-4000-8000-000000000002',
    name: 'South office',
    centreLatDeg: 47.5,
    centreLonDeg: -30.4,
    targetsHours: { 1: 4, 2: 24, 3: 72, 4: 240 },
    firstResponseHours: { 1: 1, 2: 8, 3: 24, 4: 72 },
    investigators: [],
    supervisor: null,
  },
]

function generate(count: number, seed: number) {
  const d = new Draw(seed)
  const now = new Date('2026-06-01T12:00:00Z')
  const recent = new Map<string, string[]>()
  return Array.from({ length: count }, (_, i) => makeCase(d, offices, new Date(now.getTime() - (count - i) * 0.5 * DAY_MS), now, i + 1, recent))
}

describe('synthetic cases walk the case lifecycle', () => {
  const cases = generate(3000, 7)

  it('make every move from a state CASE_MOVES allows it from, landing where CASE_MOVES says', () => {
    for (const c of cases) {
      const moves = c.events.filter((e) => e.kind !== 'received' && e.kind !== 'routed')
      let state: string = 'received'
      for (const e of moves) {
        const move = CASE_MOVES[e.kind as CaseMoveName]
        expect(move, e.kind).toBeDefined()
        expect(e.fromState).toBe(state)
        expect(move.from as readonly string[]).toContain(e.fromState)
        expect(e.toState).toBe(move.to)
        state = e.toState!
      }
      expect(state).toBe(c.status)
      expect(c.version).toBe(moves.length + 1)
    }
  })

  it('close exactly the cases that carry a resolution, and join duplicates to an earlier case', () => {
    for (const c of cases) {
      expect(c.status === 'closed').toBe(c.resolution !== null)
      expect(c.status === 'closed').toBe(c.closedAt !== null)
      if (c.resolution === 'duplicate') expect(c.mergedIntoCaseId).not.toBeNull()
      else expect(c.mergedIntoCaseId).toBeNull()
    }
  })

  it('reach every state and every resolution over three thousand cases', () => {
    expect(new Set(cases.map((c) => c.status))).toEqual(new Set(CASE_STATES))
    expect(new Set(cases.map((c) => c.resolution).filter((r) => r !== null))).toEqual(new Set(RESOLUTIONS))
  })

  it('give the same cases for the same seed', () => {
    const strip = (cs: ReturnType<typeof generate>) => cs.map(({ id: _id, mergedIntoCaseId: _m, ...rest }) => rest)
    expect(strip(generate(200, 3))).toEqual(strip(generate(200, 3)))
  })

  it('refuses a closed case without a resolution, and an open one with a resolution', () => {
    expect(() => walkTo('closed', null)).toThrow(RangeError)
    expect(() => walkTo('assigned', 'referred')).toThrow(RangeError)
  })
})

describe('the generator command line', () => {
  it('reads the options with their defaults', () => {
    const args = commandLine(['--count', '2000', '--database-url', 'postgres://u:p@127.0.0.1:5/db', '--yes'])
    expect(args).toEqual({ count: 2000, databaseUrl: 'postgres://u:p@127.0.0.1:5/db', seed: 1, investigatorsPerOffice: 6, batchSize: 2000, yes: true, migrateAndSeed: false })
  })
  it('answers --help with no run', () => {
    expect(commandLine(['--help'])).toBeNull()
    expect(commandLine(['-h'])).toBeNull()
  })
  it('refuses an unknown option, a missing value and a count that is not a whole number', () => {
    expect(() => commandLine(['--cont', '5'])).toThrow(/Unknown option '--cont'; see --help/)
    expect(() => commandLine(['--count'])).toThrow(/argument missing/)
    expect(() => commandLine(['--count', '2.5'])).toThrow(/--count must be a whole number ≥ 1/)
    expect(() => commandLine(['--count', '0'])).toThrow(/--count must be a whole number ≥ 1/)
  })
})
