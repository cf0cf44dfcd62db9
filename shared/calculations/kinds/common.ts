/**
 * What every calculation kind shares: the shape of a run, the refusal, and the definition a kind
 * file exports (its strict input schema, the references it names and copies, its pure `run`).
 */
import type { z } from 'zod'
import type { CoverageInterval, MethodRef } from '../../radio'
import type { ReferenceLookup } from '../references'

/** JSON as stored in a record's jsonb columns. */
export type Json = null | boolean | number | string | Json[] | { [key: string]: Json }

/** What a run gives: stored as the record's outputs, warnings and methods. */
export interface CalculationRun {
  /** The result's value (and its interval, when there is one), JSON only. */
  outputs: { value: Json; interval?: CoverageInterval }
  warnings: string[]
  /** The method of every step, main method first. */
  methods: MethodRef[]
  /** One line for the case's timeline. */
  summary: string
}

/** Thrown for input that passes the schema but that the library refuses (its RangeError's words). */
export class CalculationRefused extends Error {}

/** The ids of the stored things a calculation's inputs name; the server reads them before it runs. */
export interface NamedReferences {
  bandLimitKeys?: string[]
  measurementIds?: string[]
  stationIds?: string[]
  calculationIds?: string[]
}

/** One kind of calculation: its key, its label, its strict inputs, what it names and copies, and its pure run. */
export interface CalculationKindDef<S extends z.ZodType = z.ZodType, K extends string = string> {
  kind: K
  label: string
  inputSchema: S
  /** How the web reads `outputs.value` of this kind's records. */
  outputSchema?: z.ZodType
  /** The stored things the inputs name (ids), so the server can read them all before running. */
  named(inputs: z.infer<S>): NamedReferences
  /** Copies of every reference the inputs name, taken when the record is stored. */
  references(inputs: z.infer<S>, lookup: ReferenceLookup): Record<string, Json>
  /** Pure and deterministic: inputs and the record's own copies only. */
  run(inputs: z.infer<S>, references: Record<string, unknown>): CalculationRun
}

export const defineKind = <S extends z.ZodType, K extends string>(d: CalculationKindDef<S, K>) => d

export const toJson = (x: unknown): Json => JSON.parse(JSON.stringify(x)) as Json
export const toJsonObject = (x: unknown): Record<string, Json> => toJson(x) as Record<string, Json>
export const f2 = (v: number) => v.toFixed(2)

/** Runs library code; its RangeError (impossible input) becomes a refusal in the library's words. */
export function runLibrary<T>(work: () => T): T {
  try {
    return work()
  } catch (e) {
    if (e instanceof RangeError) throw new CalculationRefused(e.message)
    throw e
  }
}
