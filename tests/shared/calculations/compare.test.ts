/** Stored against recomputed outputs: numbers by relative difference, everything else as it is. */
import { describe, expect, it } from 'vitest'
import { compareOutputs, RECOMPUTE_RELATIVE_TOLERANCE, relativeDifference } from '../../../shared/calculations/compare'

describe('comparing a record’s outputs with a recomputation', () => {
  it('finds no difference between equal outputs', () => {
    const o = { value: { eirpDbm: 30, verdict: 'within', rows: [{ u: 0.75 }] }, interval: { low: 28.5, high: 31.5 } }
    expect(compareOutputs(o, structuredClone(o)).filter((d) => d.differs)).toEqual([])
  })

  it('lets a difference within the tolerance pass and flags one beyond it', () => {
    const at = compareOutputs({ x: 1 }, { x: 1 + RECOMPUTE_RELATIVE_TOLERANCE / 2 })[0]!
    expect(at.differs).toBe(false)
    const beyond = compareOutputs({ x: 1 }, { x: 1 + 1e-8 })[0]!
    expect(beyond).toMatchObject({ path: 'x', differs: true })
    expect(beyond.relativeDifference).toBeCloseTo(1e-8, 15)
  })

  it('flags a changed verdict, and a value that appeared or vanished', () => {
    const d = compareOutputs({ value: { verdict: 'within', a: 1 } }, { value: { verdict: 'exceeds', b: 2 } })
    expect(d.map((x) => [x.path, x.differs])).toEqual([
      ['value.verdict', true],
      ['value.a', true],
      ['value.b', true],
    ])
  })

  it('measures relative difference against the larger magnitude, and zero between two zeros', () => {
    expect(relativeDifference(0, 0)).toBe(0)
    expect(relativeDifference(-2, -1)).toBe(0.5)
    expect(relativeDifference(0, 1e-300)).toBe(1)
  })
})
