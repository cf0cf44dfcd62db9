/**
 * The retention helpers: the redacted copy of a complainant's text masks contact details and
 * their name but keeps the technical facts; the end of a period and the months a follow-up needs.
 */
import { describe, expect, it } from 'vitest'
import { coarsenDeg, erasedFileName, erasureMarker, monthsNeededFor, redactComplainantText, retentionEndsAt } from '../../shared/domain/retention'

describe('redactComplainantText', () => {
  const who = { name: 'Ines Marlow', email: 'ines@example.test', phone: '+44 20 7946 0958', organisation: null }
  it('masks e-mail and web addresses, phone-like numbers and the complainant’s name', () => {
    const out = redactComplainantText('Ines here: call +44 20 7946 0958 or 0161-496-0000, mail ines@example.test or ines.m@other.test, see www.marlow.test/x. Signed, MARLOW.', who)
    expect(out).toBe('[name removed] here: call [number removed] or [number removed], mail [e-mail removed] or [e-mail removed], see [address removed]. Signed, [name removed].')
  })
  it('keeps frequencies, levels, dates and times', () => {
    const text = 'Hum at 433.92 MHz, −61.5 dBm, since 2026-11-20 after 21:00; 3 houses affected.'
    expect(redactComplainantText(text, who)).toBe(text)
  })
  it('keeps case references, which are not phone numbers', () => {
    expect(redactComplainantText('Same as QB-26-000123; call 0161 496 0000 or tel-0161 496 0001.', who)).toBe('Same as QB-26-000123; call [number removed] or tel-[number removed].')
  })
  it('does not mask a name inside another word', () => {
    expect(redactComplainantText('Inesbridge road', who)).toBe('Inesbridge road')
  })
  it('masks the case’s address as written, before its words are looked at', () => {
    expect(redactComplainantText('Loud hum at 7 Marlow Row, Harrowmere, 2 m from the mast.', { ...who, address: '7 Marlow Row, Harrowmere' })).toBe('Loud hum at [address removed], 2 m from the mast.')
  })
})

describe('what erasure leaves of a file name and a position', () => {
  const sha = '3f9a0c1b2d4e5f60718293a4b5c6d7e8f90a1b2c3d4e5f60718293a4b5c6d7e8'
  it('names an erased file by its SHA-256 prefix, keeping only a known file type', () => {
    expect(erasedFileName('Ines Marlow readings.CSV', sha)).toBe('erased-3f9a0c1b2d4e.csv')
    expect(erasedFileName('capture.sigmf-data', sha)).toBe('erased-3f9a0c1b2d4e.sigmf-data')
    // an "extension" that could be a word a person chose goes too
    expect(erasedFileName('Letter.Marlow', sha)).toBe('erased-3f9a0c1b2d4e')
    expect(erasedFileName('.bashrc', sha)).toBe('erased-3f9a0c1b2d4e')
    expect(erasedFileName('no extension', sha)).toBe('erased-3f9a0c1b2d4e')
  })
  it('rounds a position to 0.01° (two decimals, as toFixed writes them)', () => {
    for (const deg of [52.40765, -1.51234, 0.004, -0.006, 179.999, -89.99501, 12.345678]) expect(coarsenDeg(deg), String(deg)).toBe(Number(deg.toFixed(2)))
  })
})

describe('retention periods', () => {
  it('adds calendar months, keeping the day or taking the month’s last', () => {
    expect(retentionEndsAt(new Date('2026-01-31T10:00:00Z'), 1).toISOString()).toBe('2026-02-28T10:00:00.000Z')
    expect(retentionEndsAt(new Date('2027-01-31T10:00:00Z'), 13).toISOString()).toBe('2028-02-29T10:00:00.000Z')
    expect(retentionEndsAt(new Date('2026-03-15T00:00:00Z'), 24).toISOString()).toBe('2028-03-15T00:00:00.000Z')
  })
  it('counts the fewest months that outlast the end of a follow-up’s day', () => {
    const closed = new Date('2026-03-15T12:00:00Z')
    expect(monthsNeededFor(closed, '2026-03-15')).toBe(1)
    expect(monthsNeededFor(closed, '2026-04-14')).toBe(1)
    expect(monthsNeededFor(closed, '2026-04-15')).toBe(2) // the period would end at noon of the due day
    expect(monthsNeededFor(closed, '2027-03-16')).toBe(13)
  })
  it('marks erased fields with the day', () => {
    expect(erasureMarker(new Date('2028-03-15T23:59:00Z'))).toBe('erased on 2028-03-15')
  })
})
