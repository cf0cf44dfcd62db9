/** Compliance: limits as data, EIRP-equivalent limits, verdicts, and the band-limit reference. */
export * from './limit-spec'
export * from './assess-compliance'
export * from './band-limits'
