/** The proposal's contract: strict numbers, both coordinates or neither, no past deadline, evidence files by id. */
import { describe, expect, it } from 'vitest'
import { earliestDeadline, proposeFindingSchema } from '../../../shared/schemas/findings'

const good = { version: 3, sourceDescription: 'Masthead amplifier', recommendedAction: 'advise_operator', summary: 'It oscillates.' }
const problems = (body: Record<string, unknown>) => {
  const r = proposeFindingSchema.safeParse(body)
  return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [String(i.path[0]), i.message]))
}

describe('proposeFindingSchema', () => {
  it('reads a minimal proposal, with empty lists and no position', () => {
    const r = proposeFindingSchema.parse(good)
    expect(r).toMatchObject({ calculationIds: [], evidenceIds: [] })
    expect([r.sourceLatDeg, r.sourceLonDeg, r.operator, r.authorisedStationId, r.complianceDeadline]).toEqual([undefined, undefined, undefined, undefined, undefined])
  })

  it('reads a position through the strict number parser, with its unit', () => {
    const r = proposeFindingSchema.parse({ ...good, sourceLatDeg: '48,1021°', sourceLonDeg: -31.35 })
    expect(r.sourceLatDeg).toBe(48.1021)
    expect(r.sourceLonDeg).toBe(-31.35)
  })

  it('refuses hex, booleans and out-of-range coordinates', () => {
    expect(problems({ ...good, sourceLatDeg: '0x10', sourceLonDeg: 1 })).toHaveProperty('sourceLatDeg')
    expect(problems({ ...good, sourceLatDeg: true, sourceLonDeg: 1 })).toHaveProperty('sourceLatDeg')
    expect(problems({ ...good, sourceLatDeg: 91, sourceLonDeg: 1 }).sourceLatDeg).toBe('Latitude is between −90 and 90.')
  })

  it('asks for the other coordinate when only one is given, alongside the other fields’ problems', () => {
    expect(problems({ ...good, sourceLatDeg: '48.1', summary: '' })).toEqual({
      sourceLonDeg: 'Enter the longitude too, or clear the latitude.',
      summary: 'Summarise the finding (at least 3 characters).',
    })
  })

  it('takes a deadline from today on, never one in the past', () => {
    expect(problems({ ...good, complianceDeadline: earliestDeadline() })).toEqual({})
    const dayBefore = new Date(Date.parse(earliestDeadline()) - 86_400_000).toISOString().slice(0, 10)
    expect(problems({ ...good, complianceDeadline: dayBefore }).complianceDeadline).toBe('The deadline cannot be in the past.')
    const malformed = proposeFindingSchema.safeParse({ ...good, complianceDeadline: '20-12-2030' })
    expect(malformed.error?.issues.map((i) => i.message)).toEqual(['Enter the deadline as a date (YYYY-MM-DD).'])
    expect(proposeFindingSchema.parse({ ...good, complianceDeadline: '' }).complianceDeadline).toBeUndefined()
  })

  it('takes evidence files as ids (the server checks they are files of the case), each once', () => {
    const id = '00000000-0000-4000-8000-000000000000'
    expect(proposeFindingSchema.parse({ ...good, evidenceIds: [id] }).evidenceIds).toEqual([id])
    expect(problems({ ...good, evidenceIds: [id, id] }).evidenceIds).toBe('An evidence file is linked twice.')
    expect(problems({ ...good, evidenceIds: ['capture.csv'] }).evidenceIds).toBe('Not a valid evidence file id.')
    expect(problems({ ...good, evidenceIds: 'capture.csv' }).evidenceIds).toBe('Send the linked evidence files as a list of ids.')
  })

  it('refuses an unknown action, a calculation linked twice and a station id that is no id', () => {
    const id = '00000000-0000-4000-8000-000000000001'
    expect(problems({ ...good, recommendedAction: 'shrug', calculationIds: [id, id], authorisedStationId: 'st-9' })).toEqual({
      recommendedAction: 'Choose the recommended action.',
      calculationIds: 'A calculation is linked twice.',
      authorisedStationId: 'Not a valid station id.',
    })
  })
})
