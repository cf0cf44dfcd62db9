/**
 * How long a sign-in waits before it is answered, from the account's recent failures (from any
 * address). Repeated wrong passwords slow every try on the account down instead of locking it,
 * so a stranger's guesses cannot keep the owner out; the address that keeps guessing is refused
 * separately (auth.service). Pure, so the growth is tested as a function and tests can inject
 * a tiny delay.
 */

/** Failures an account may have before answers slow down (a few typos cost nothing). */
export const FREE_FAILURES_PER_ACCOUNT = 2
/** The first added wait [ms]; it doubles with each further failure. */
export const FIRST_DELAY_MS = 250
/** The longest wait [ms]: a few seconds, bearable for the owner typing the right password. */
export const MAX_DELAY_MS = 4_000

/** A function from the account's recent failures to the wait before answering [ms]. */
export type SignInDelay = (accountFailures: number) => number

/** 0 ms up to FREE_FAILURES_PER_ACCOUNT failures, then 250, 500, 1000, 2000 ms, then 4000 ms at most. */
export const signInDelayMs: SignInDelay = (accountFailures) => {
  const over = Math.floor(accountFailures) - FREE_FAILURES_PER_ACCOUNT
  if (!(over > 0)) return 0
  // 2^(over-1) grows past the cap long before it overflows; the exponent is clamped anyway
  return Math.min(MAX_DELAY_MS, FIRST_DELAY_MS * 2 ** Math.min(over - 1, 30))
}

export const wait = (ms: number): Promise<void> => (ms > 0 ? new Promise((resolve) => setTimeout(resolve, ms)) : Promise.resolve())
