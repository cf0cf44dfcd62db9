/** RF exposure screening against ICNIRP (2020) reference levels. */
export * from './icnirp-2020-reference-levels'
export * from './screening'
