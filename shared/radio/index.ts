/**
 * The radio library's public API: one entry point for the server and the browser.
 *
 * Pure and isomorphic: no I/O, no clock, no unseeded randomness. Every result that can feed a
 * finding carries `method: { id, source }`; a stored result also stores RADIO_LIBRARY_VERSION
 * so it can be recomputed with the same numbers later. Methods and their sources: README.md.
 */

/**
 * Semantic version of the library's numbers. Bump it whenever any numeric result can change
 * (major: a method's meaning or inputs change; minor: a method is added; patch: a correction
 * that moves a number). Stored results carry it next to their method id.
 */
export const RADIO_LIBRARY_VERSION = '2.3.0'

export * from './types'
export * from './constants'
export * from './guards'
export * from './units'
export * from './chain'
export * from './propagation'
export * from './estimation'
export * from './uncertainty'
export * from './geo'
export * from './compliance'
export * from './coexistence'
export * from './exposure'
export * from './spectrum'
