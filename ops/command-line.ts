/**
 * Command-line options of the ops scripts, read with node:util parseArgs: unknown options and
 * missing values are refused with parseArgs' own message, numbers are checked here, and the
 * usage text is written from the same table as the parser.
 */
import { parseArgs } from 'node:util'

export interface OptionHelp {
  type: 'string' | 'boolean'
  /** What the value is, for the usage line (`--count N`). */
  value?: string
  default?: string
  help: string
}

/** The usage text of a script: its command and one line per option. */
export function usage(command: string, options: Record<string, OptionHelp>): string {
  const lines = Object.entries(options).map(([name, o]) => {
    const flag = `--${name}${o.value ? ` ${o.value}` : ''}`
    return `  ${flag.padEnd(34)}${o.help}${o.default !== undefined ? ` (default ${o.default})` : ''}`
  })
  return [`usage: ${command} [options]`, '', ...lines, `  ${'--help'.padEnd(34)}this text`].join('\n')
}

/**
 * Reads the options of a script (strictly: an unknown option is an error). Returns the values,
 * or `help: true` when --help or -h was given.
 */
export function readOptions<T extends Record<string, OptionHelp>>(options: T, argv: string[] = process.argv.slice(2)) {
  const config = Object.fromEntries(Object.entries(options).map(([name, o]) => [name, o.default !== undefined ? { type: o.type, default: o.default } : { type: o.type }]))
  let values
  try {
    ;({ values } = parseArgs({ args: argv, options: { ...config, help: { type: 'boolean', short: 'h' } }, strict: true, allowPositionals: false }))
  } catch (e) {
    // parseArgs' own message names the option ("Unknown option '--cont'"); point to the usage
    if (e instanceof TypeError && 'code' in e && String(e.code).startsWith('ERR_PARSE_ARGS')) throw new RangeError(`${e.message}; see --help`, { cause: e })
    throw e
  }
  return values as { [K in keyof T]: T[K]['type'] extends 'boolean' ? boolean | undefined : string | undefined } & { help?: boolean }
}

/** A whole number of at least `min` from an option's text, or an error naming the option. */
export function integerOption(name: string, text: string | undefined, min: number): number {
  const n = Number(text)
  if (text === undefined || text.trim() === '' || !Number.isInteger(n) || n < min) throw new RangeError(`--${name} must be a whole number ≥ ${min} (got ${text ?? 'nothing'})`)
  return n
}

/**
 * One `--name value` option of a benchmark script, read with parseArgs among options it does
 * not know (each script reads its own), with a default.
 */
export function optionValue(name: string, fallback: string, argv?: string[]): string
export function optionValue(name: string, fallback?: string, argv?: string[]): string | undefined
export function optionValue(name: string, fallback?: string, argv: string[] = process.argv.slice(2)): string | undefined {
  const key = name.replace(/^--/, '')
  const { values } = parseArgs({ args: argv, options: { [key]: { type: 'string' } }, strict: false, allowPositionals: true })
  const v = values[key]
  return typeof v === 'string' ? v : fallback
}
