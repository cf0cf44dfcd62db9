/** Calculations a case keeps as records: the kinds, their strict inputs, and stored-against-recomputed comparison. */
export * from './kinds'
export * from './compare'
export * from './references'
