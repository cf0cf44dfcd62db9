import { sql, type SQL } from 'drizzle-orm'

/**
 * A constant list as an SQL literal list, `('a', 'b')` or `(1, 2)`, for CHECK constraints and
 * index predicates built from the arrays in shared/domain (DDL takes no parameters). For
 * constants of the code only, never for input.
 */
export function sqlList(values: readonly (string | number)[]): SQL {
  if (values.length === 0) throw new Error('sqlList: an empty list')
  return sql.raw(`(${values.map((v) => (typeof v === 'number' ? String(v) : `'${v.replace(/'/g, "''")}'`)).join(', ')})`)
}
