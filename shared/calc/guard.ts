// Input checks shared by the trade-maths functions: every bad value throws a RangeError naming it.

function show(value: unknown): string {
  return typeof value === 'string' ? JSON.stringify(value) : String(value);
}

export function requireFinite(name: string, value: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number, got ${show(value)}`);
  }
  return value;
}

export function requireNonNegative(name: string, value: number): number {
  requireFinite(name, value);
  if (value < 0) throw new RangeError(`${name} must not be negative, got ${show(value)}`);
  return value;
}

export function requirePositive(name: string, value: number): number {
  requireFinite(name, value);
  if (value <= 0) throw new RangeError(`${name} must be greater than 0, got ${show(value)}`);
  return value;
}

export function requireInteger(name: string, value: number, min: number, max: number): number {
  requireFinite(name, value);
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new RangeError(`${name} must be a whole number from ${min} to ${max}, got ${show(value)}`);
  }
  return value;
}

export function requireOneOf<T extends string>(name: string, value: T, allowed: readonly T[]): T {
  if (!allowed.includes(value)) {
    throw new RangeError(`${name} must be one of ${allowed.map((a) => `'${a}'`).join(', ')}, got ${show(value)}`);
  }
  return value;
}
