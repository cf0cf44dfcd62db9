/**
 * The case list's total. Counting every matching row on every page costs as much as reading
 * them (an administrator's "not overdue" matches nearly the whole table), so the server counts
 * exactly up to EXACT_TOTAL_UP_TO matches and then stops: past it the page says
 * "10,000+" and pages on while pages are full.
 */
export const EXACT_TOTAL_UP_TO = 10_000

/** "1,234" for an exact total, "10,000+" for one the server stopped counting. */
export function formatCaseTotal(total: number, totalCapped: boolean): string {
  return `${total.toLocaleString('en-GB')}${totalCapped ? '+' : ''}`
}
