/**
 * Argument checks shared by the public entry points: each throws a RangeError
 * naming the argument and the allowed range, so nothing returns NaN silently.
 */

/** Throws unless `value` is a finite number. */
export function requireFinite(name: string, value: number, allowed: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (${allowed}); got ${String(value)}`);
  }
}

/** Throws unless `value` is finite and strictly greater than `lower`. */
export function requireAbove(name: string, value: number, lower: number, allowed: string): void {
  requireFinite(name, value, allowed);
  if (!(value > lower)) throw new RangeError(`${name} must be ${allowed}; got ${value}`);
}

/** Throws unless `value` is finite and at least `lower`. */
export function requireAtLeast(name: string, value: number, lower: number, allowed: string): void {
  requireFinite(name, value, allowed);
  if (!(value >= lower)) throw new RangeError(`${name} must be ${allowed}; got ${value}`);
}

/** Throws unless `value` is finite and inside [lower, upper]. */
export function requireInRange(name: string, value: number, lower: number, upper: number, allowed: string): void {
  requireFinite(name, value, allowed);
  if (!(value >= lower && value <= upper)) throw new RangeError(`${name} must be ${allowed}; got ${value}`);
}
