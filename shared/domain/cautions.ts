/**
 * The product's standing cautions, one wording for the web (components/cautions) and the
 * server's documents (the case file).
 */

/** Shown wherever results are read, and in the footer of every page. */
export const CAUTION_LINES = [
  "Estimates support, and do not replace, the regulator's legal procedure and the judgement of a qualified engineer.",
  "Measurements follow your office's calibrated procedures.",
  'RF exposure figures are screening values; local codes and licensed practice govern.',
] as const

/**
 * Shown wherever a finding is read: a finding that rests on an estimate supports, and does not
 * replace, the regulator's procedure; enforcement follows local codes and licensed practice.
 */
export const ENFORCEMENT_CAUTION =
  'A finding that rests on an estimate must follow local codes and licensed practice before any enforcement step: the estimate supports, and does not replace, the legal procedure and a qualified engineer\u2019s judgement.'
