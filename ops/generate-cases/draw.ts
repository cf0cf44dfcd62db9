/**
 * Draws for the synthetic-case generator on top of the library's seeded uniform source
 * (shared/radio/uncertainty/prng.ts, mulberry32): the same seed gives the same cases.
 */
import { createUniformSource } from '../../shared/radio/uncertainty/prng'

export class Draw {
  readonly next: () => number
  constructor(seed: number) {
    this.next = createUniformSource(seed)
  }
  between(lo: number, hi: number): number {
    return lo + (hi - lo) * this.next()
  }
  int(lo: number, hiInclusive: number): number {
    return Math.floor(this.between(lo, hiInclusive + 1))
  }
  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.next() * items.length)]!
  }
  chance(p: number): boolean {
    return this.next() < p
  }
  weighted<T>(items: readonly (readonly [T, number])[]): T {
    const total = items.reduce((s, [, w]) => s + w, 0)
    let r = this.next() * total
    for (const [item, w] of items) {
      r -= w
      if (r < 0) return item
    }
    return items[items.length - 1]![0]
  }
  /** Log-uniform between lo and hi (frequencies spread over decades). */
  logUniform(lo: number, hi: number): number {
    return Math.exp(this.between(Math.log(lo), Math.log(hi)))
  }
}
