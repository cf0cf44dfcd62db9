/**
 * The design tokens in web/src/styles.css must keep the contrast web/DESIGN.md promises.
 * Contrast ratio and relative luminance as defined in WCAG 2.1 (W3C Recommendation, "contrast
 * ratio" and "relative luminance" definitions); thresholds from WCAG 2.1 SC 1.4.3 (4.5:1 for
 * text) and SC 1.4.11 (3:1 for control boundaries and graphics).
 */
import { readFileSync } from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'

// A path, not a URL: in the web project's DOM, URL is the DOM's own, which node:fs does not take.
const here = path.dirname(fileURLToPath(import.meta.url))
const css = readFileSync(path.join(here, '../../web/src/styles.css'), 'utf8')
const tokens = new Map([...css.matchAll(/--color-([a-z0-9-]+):\s*(#[0-9a-f]{6})/gi)].map((m) => [m[1]!, m[2]!]))

function relativeLuminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4))
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!
}

function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x)
  return (hi! + 0.05) / (lo! + 0.05)
}

const token = (name: string) => {
  const value = tokens.get(name)
  if (!value) throw new Error(`styles.css has no --color-${name}`)
  return value
}

describe('WCAG 2.1 contrast ratio as implemented here', () => {
  it('gives 21:1 for black on white and 1:1 for a colour on itself (the definition\'s end points, exact)', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 10)
    expect(contrastRatio('#0e5a6e', '#0e5a6e')).toBeCloseTo(1, 10)
  })
})

describe('Quietband palette', () => {
  const textPairs: [string, string][] = [
    ['ink', 'paper'], ['ink', 'surface'], ['ink-muted', 'paper'], ['ink-muted', 'surface'],
    ['signal', 'paper'], ['signal', 'surface'], ['signal', 'signal-soft'], ['surface', 'signal'], ['surface', 'signal-strong'],
    ['paper', 'ink'], ['ink', 'signal-soft'],
    ['caution', 'caution-soft'], ['caution', 'surface'], ['danger', 'danger-soft'], ['danger', 'surface'], ['danger', 'paper'],
    ['ok', 'ok-soft'], ['ok', 'surface'],
    ['priority-1', 'surface'], ['priority-2', 'surface'], ['priority-3', 'surface'], ['priority-4', 'surface'],
    ['priority-1', 'paper'], ['priority-2', 'paper'], ['priority-3', 'paper'], ['priority-4', 'paper'],
    ['ink', 'caution-soft'], ['ink', 'danger-soft'], ['ink', 'ok-soft'],
  ]
  it.each(textPairs)('keeps %s text on %s at WCAG 2.1 AA (≥ 4.5:1, SC 1.4.3)', (fg, bg) => {
    expect(contrastRatio(token(fg), token(bg))).toBeGreaterThanOrEqual(4.5)
  })

  it.each([['field', 'surface'], ['field', 'paper'], ['signal', 'paper']])(
    'keeps %s control borders on %s at ≥ 3:1 (WCAG 2.1 SC 1.4.11)',
    (fg, bg) => {
      expect(contrastRatio(token(fg), token(bg))).toBeGreaterThanOrEqual(3)
    },
  )
})
