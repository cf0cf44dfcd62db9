/** The charts' data preparation (components/charts/lib): the parts that need no canvas. */
import { describe, expect, it } from 'vitest'
import { combineUncertainty } from '../../shared/radio/uncertainty/gum-budget'
import { budgetBars, distanceSpanM, formatDistanceTick, levelChartData, logDistanceSplits, logSpacedM, residualChartData, sortByDistance } from '@/components/charts/lib/chart-data'

describe('log spacing of curve samples', () => {
  it('spaces samples evenly in log d, ends included', () => {
    const d = logSpacedM(1, 1000, 4)
    expect(d[0]).toBe(1)
    expect(d[1]).toBeCloseTo(10, 9)
    expect(d[2]).toBeCloseTo(100, 9)
    expect(d[3]).toBe(1000)
    const ratios = logSpacedM(30, 20_000, 64).map((x, i, a) => (i ? x / a[i - 1]! : NaN)).slice(1)
    for (const r of ratios) expect(r).toBeCloseTo(ratios[0]!, 9)
  })

  it('refuses a span a log axis cannot show', () => {
    expect(() => logSpacedM(0, 10, 5)).toThrow(RangeError)
    expect(() => logSpacedM(10, 10, 5)).toThrow(RangeError)
    expect(() => logSpacedM(1, 10, 1)).toThrow(RangeError)
  })
})

describe('the distance axis', () => {
  it('widens to half decades around the distances', () => {
    const s = distanceSpanM([120, 2400])!
    expect(s.minM).toBeCloseTo(100, 9)
    expect(s.maxM).toBeCloseTo(10 ** 3.5, 9)
    expect(distanceSpanM([1000])).toEqual({ minM: 10 ** 2.5, maxM: 10 ** 3.5 })
    expect(distanceSpanM([0, -5, Number.NaN])).toBeNull()
  })

  it('keeps a given span', () => {
    expect(distanceSpanM([5], { minM: 1, maxM: 50_000 })).toEqual({ minM: 1, maxM: 50_000 })
  })

  it('sorts by distance and leaves out what a log axis cannot show', () => {
    const { sorted, dropped } = sortByDistance([{ distanceM: 300 }, { distanceM: 0 }, { distanceM: 20 }, { distanceM: Number.POSITIVE_INFINITY }])
    expect(sorted.map((p) => p.distanceM)).toEqual([20, 300])
    expect(dropped).toBe(2)
  })

  it('writes ticks in metres below a kilometre and in kilometres from there', () => {
    expect(formatDistanceTick(100)).toBe('100 m')
    expect(formatDistanceTick(31.622776)).toBe('31.6 m')
    expect(formatDistanceTick(3162.2776)).toBe('3.16 km')
    expect(formatDistanceTick(100_000)).toBe('100 km')
  })
})

describe('level–distance data', () => {
  // A power law with n = 2: L(d) = 40 + 20 log10(d / 1 m) dB of path loss [D]; a ±6 dB band.
  const curve = { label: 'Log-distance, n = 2', valueAt: (d: number) => 40 + 20 * Math.log10(d) }
  const band = { label: '95 % interval', boundsAt: (d: number) => ({ lower: curve.valueAt(d) - 6, upper: curve.valueAt(d) + 6 }) }
  const points = [
    { distanceM: 800, value: 99.5, label: 'M2' },
    { distanceM: 150, value: 82.1, label: 'M1' },
    { distanceM: 0, value: 10, label: 'at the mast' },
  ]
  const data = levelChartData({ points, curve, band, marks: [{ label: 'Breakpoint', distanceM: 500 }], samples: 16 })

  it('merges the points and the curve samples in distance order', () => {
    expect(data.x).toHaveLength(2 + 16)
    for (let i = 1; i < data.x.length; i++) expect(data.x[i]!).toBeGreaterThanOrEqual(data.x[i - 1]!)
    expect(data.x[0]).toBeCloseTo(100, 9) // the span starts a half decade below: 100 m
    expect(data.x.at(-1)).toBeCloseTo(1000, 9)
  })

  it('puts each measured value at its own distance and none at the samples', () => {
    const at = (d: number) => data.x.indexOf(d)
    expect(data.measured[at(150)]).toBe(82.1)
    expect(data.labels[at(800)]).toBe('M2')
    expect(data.measured.filter((v) => v !== null)).toHaveLength(2)
    expect(data.dropped).toBe(1)
  })

  it('evaluates the curve and its band at every x, the band 6 dB each side', () => {
    data.x.forEach((x, i) => {
      expect(data.model[i]).toBeCloseTo(40 + 20 * Math.log10(x), 9)
      expect(data.upper[i]! - data.model[i]!).toBeCloseTo(6, 9)
      expect(data.model[i]! - data.lower[i]!).toBeCloseTo(6, 9)
    })
    expect(data.model[0]).toBeCloseTo(80, 9) // 40 + 20 log10(100)
  })

  it('widens the span to hold the marks, and leaves out marks beyond a given span', () => {
    expect(data.marks).toEqual([{ label: 'Breakpoint', distanceM: 500 }])
    const far = { label: 'Far away', distanceM: 1e5 }
    expect(levelChartData({ points, marks: [far] }).span!.maxM).toBeCloseTo(1e5, 6)
    expect(levelChartData({ points, marks: [far], distanceRangeM: { minM: 100, maxM: 1000 } }).marks).toEqual([])
  })

  it('has only the points without a curve, and blanks where a model gives no number', () => {
    const bare = levelChartData({ points })
    expect(bare.x).toEqual([150, 800])
    expect(bare.model).toEqual([null, null])
    const gappy = levelChartData({ points, curve: { label: 'x', valueAt: (d) => (d > 500 ? Number.NaN : 1) }, samples: 4 })
    expect(gappy.model.at(-1)).toBeNull()
  })
})

describe('residual data', () => {
  it('sorts by distance and centres zero with a whole-dB half range and 0.5 dB of headroom', () => {
    const r = residualChartData([
      { distanceM: 900, residualDb: -2.4 },
      { distanceM: 90, residualDb: 3.2, label: 'M1' },
    ])
    expect(r.x).toEqual([90, 900])
    expect(r.residual).toEqual([3.2, -2.4])
    expect(r.labels).toEqual(['M1', null])
    expect(r.halfRangeDb).toBe(4) // ceil(3.2 + 0.5)
    expect(residualChartData([]).halfRangeDb).toBe(1)
    expect(residualChartData([{ distanceM: 10, residualDb: -3.6 }]).halfRangeDb).toBe(5)
  })
})

describe('budget bars', () => {
  // EA-4/02 M:2013 example S2 (weight of 10 kg), its inputs as tabulated in a published
  // reproduction (metrodata.de/examples/s02_en.html): shares 59.6, 8.8, 23.7, 3.9, 3.9 % [V-S]; register 12-E.
  it('shows the EA-4/02 S2 budget’s shares, largest first, as the published percentages', () => {
    const s2 = combineUncertainty({
      contributions: [
        { name: 'reference standard', distribution: { kind: 'normal', expandedUncertainty: 0.045, coverageFactor: 2 } },
        { name: 'drift', distribution: { kind: 'rectangular', halfWidth: 0.015 } },
        { name: 'comparator', distribution: { kind: 'standard', standardUncertainty: 0.0142 } },
        { name: 'eccentricity', distribution: { kind: 'rectangular', halfWidth: 0.01 } },
        { name: 'air buoyancy', distribution: { kind: 'rectangular', halfWidth: 0.01 } },
      ],
    })
    const bars = budgetBars(s2.rows.map((r) => ({ name: r.name, contributionDb: r.contribution, varianceShare: r.varianceShare })))
    expect(bars.map((b) => b.name)).toEqual(['reference standard', 'comparator', 'drift', 'eccentricity', 'air buoyancy'])
    expect(bars.map((b) => b.percent)).toEqual([59.6, 23.7, 8.8, 3.9, 3.9])
  })

  it('leaves out rows without a usable share', () => {
    expect(budgetBars([{ name: 'x', contributionDb: 1, varianceShare: Number.NaN }, { name: 'y', contributionDb: 1, varianceShare: 1 }]).map((b) => b.name)).toEqual(['y'])
  })
})

describe('ticks of a log distance axis', () => {
  it('falls on round distances, 1, 2 and 5 × 10^k, inside the range', () => {
    expect(logDistanceSplits(70, 1100)).toEqual([100, 200, 500, 1000])
    expect(logDistanceSplits(1, 10)).toEqual([1, 2, 5, 10])
  })

  it('keeps to the decades when a wide range would crowd the axis', () => {
    expect(logDistanceSplits(1, 1e6)).toEqual([1, 10, 100, 1000, 10000, 100000, 1e6])
  })

  it('gives no tick for a range a log axis cannot show', () => {
    expect(logDistanceSplits(0, 100)).toEqual([])
    expect(logDistanceSplits(100, 100)).toEqual([])
  })
})
