/** Uncertainty: GUM budgets, the distance sensitivity of EIRP, seeded Monte Carlo and Student t. */
export * from './gum-budget'
export * from './distance-sensitivity'
export * from './prng'
export * from './monte-carlo'
export * from './student-t'
