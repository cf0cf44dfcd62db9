/**
 * Input guards. Impossible input (non-finite, zero or negative where physics forbids it)
 * throws a RangeError naming the quantity; input merely outside a model's validity is a
 * warning in the result instead (see checkValidity).
 */

export function requireFinite(name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)}).`)
  }
  return value
}

export function requirePositive(name: string, value: number): number {
  requireFinite(name, value)
  if (value <= 0) throw new RangeError(`${name} must be greater than zero (got ${value}).`)
  return value
}

export function requireNonNegative(name: string, value: number): number {
  requireFinite(name, value)
  if (value < 0) throw new RangeError(`${name} must not be negative (got ${value}).`)
  return value
}

export function requireNonEmpty<T>(name: string, values: ArrayLike<T>): ArrayLike<T> {
  if (!values || values.length === 0) throw new RangeError(`${name} must not be empty.`)
  return values
}

export function requireInRange(name: string, value: number, min: number, max: number, unit = ''): number {
  requireFinite(name, value)
  if (value < min || value > max) {
    throw new RangeError(`${name} must be between ${min} and ${max}${unit ? ' ' + unit : ''} (got ${value}).`)
  }
  return value
}
