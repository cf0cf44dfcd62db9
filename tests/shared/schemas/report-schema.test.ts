import { describe, expect, it } from 'vitest'
import { caseListQuerySchema, latestSinceDate, reportFrequencyHz, reportSchema, SINCE_DATE_FUTURE_TOLERANCE_DAYS } from '../../../shared/schemas/cases'

const good = {
  name: 'Ines Marlow',
  email: 'ines.marlow@example.test',
  service: 'mobile_network',
  frequencyFrom: 1710,
  frequencyTo: 1785,
  frequencyUnit: 'MHz',
  address: '14 Quarry Lane, Harrowmere',
  latDeg: 48.1,
  lonDeg: -31.35,
  since: '2026-11-20',
  pattern: 'continuous',
  experience: 'outage',
  description: 'No mobile signal at home since the neighbour installed a box in the loft.',
}

const issues = (over: Record<string, unknown>) => {
  const r = reportSchema.safeParse({ ...good, ...over })
  return r.success ? [] : r.error.issues.map((i) => [i.path.join('.'), i.message])
}

describe('the report schema’s numbers', () => {
  it.each([
    ['latDeg', false],
    ['latDeg', []],
    ['lonDeg', true],
    ['frequencyFrom', true],
    ['frequencyFrom', '0x10'],
    ['frequencyFrom', { value: 5 }],
    ['frequencyTo', ['1785']],
  ])('refuses %s = %j instead of reading it as a number', (field, input) => {
    expect(issues({ [field]: input })).toEqual([[field, expect.stringMatching(/as a decimal number/)]])
  })

  it('refuses a subnormal frequency such as 1e-320 kHz', () => {
    expect(issues({ frequencyFrom: 1e-320, frequencyTo: undefined, frequencyUnit: 'kHz' })).toEqual([['frequencyFrom', 'The frequency is too close to zero to be a real value.']])
  })

  it('accepts the strings a web form sends, with a decimal comma or the unit written in', () => {
    const r = reportSchema.parse({ ...good, frequencyFrom: '433,92', frequencyTo: '434.79 MHz', latDeg: '48,1', lonDeg: '\u221231.35' })
    expect(r).toMatchObject({ frequencyFrom: 433.92, frequencyTo: 434.79, frequencyUnit: 'MHz', latDeg: 48.1, lonDeg: -31.35 })
    expect(reportFrequencyHz(r)).toEqual({ lowHz: 433_920_000, highHz: 434_790_000 })
  })

  it('gives a frequency written in another unit in the unit chosen, so the result is a valid report again', () => {
    const r = reportSchema.parse({ ...good, frequencyFrom: '433.92 MHz', frequencyTo: undefined, frequencyUnit: 'kHz' })
    expect(r).toMatchObject({ frequencyFrom: 433_920, frequencyUnit: 'kHz' })
    expect(reportSchema.parse(r)).toEqual(r)
  })

  it('still lists a bad frequency beside the other fields’ errors', () => {
    const paths = issues({ name: '', frequencyFrom: -3, latDeg: 95 }).map(([p]) => p)
    expect(paths).toEqual(expect.arrayContaining(['name', 'frequencyFrom', 'latDeg']))
  })

  it('keeps the 3 THz ceiling and the order of the two ends, in whatever unit they are written', () => {
    expect(issues({ frequencyFrom: '3.1 THz', frequencyTo: undefined })).toEqual([['frequencyFrom', 'Radio frequencies end at 3 THz.']])
    expect(issues({ frequencyFrom: '1.8 GHz', frequencyTo: 1785 })).toEqual([['frequencyTo', 'The upper frequency must not be below the lower one.']])
  })
})

describe('the report schema’s start date', () => {
  it('refuses a date in the future with a plain message', () => {
    expect(issues({ since: '2999-01-01' })).toEqual([['since', 'The date it started cannot be in the future.']])
  })

  it(`allows ${SINCE_DATE_FUTURE_TOLERANCE_DAYS} day past today’s UTC date for time zones ahead of UTC, and not one more`, () => {
    const now = new Date()
    expect(issues({ since: now.toISOString().slice(0, 10) })).toEqual([])
    expect(issues({ since: latestSinceDate(now) })).toEqual([])
    const dayAfter = new Date(now.getTime() + (SINCE_DATE_FUTURE_TOLERANCE_DAYS + 1) * 86_400_000).toISOString().slice(0, 10)
    expect(issues({ since: dayAfter })).toEqual([['since', 'The date it started cannot be in the future.']])
  })
})

describe('the case list query’s numbers', () => {
  it('reads pages and priorities strictly and frequency bounds with their unit', () => {
    expect(caseListQuerySchema.parse({ page: '2', priority: '1,2', freqFromHz: '156.8 MHz' })).toMatchObject({ page: 2, pageSize: 25, priority: [1, 2], freqFromHz: 156_800_000 })
    for (const q of [{ page: '0x2' }, { page: '1.5' }, { pageSize: '' + 1e9 }, { priority: '1,true' }, { freqFromHz: '1e-320' }, { freqToHz: '0x10' }]) {
      expect(caseListQuerySchema.safeParse(q).success, JSON.stringify(q)).toBe(false)
    }
  })
})
