// Typed refusal of meaningless input, shared by every engine module.
// Route handlers map it to HTTP 400 (bad input) with `field` in the error details.

export class EngineInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'EngineInputError';
    this.field = field;
  }
}

/**
 * Well-formed input for which no operating point exists: the pump and engine curves do not meet
 * inside the ranges they were given on. Route handlers map it to HTTP 422 naming which curve.
 */
export class EngineOperatingPointError extends Error {
  readonly curve: 'engine' | 'pump';
  readonly speedMs: number;

  constructor(curve: 'engine' | 'pump', speedMs: number, message: string) {
    super(message);
    this.name = 'EngineOperatingPointError';
    this.curve = curve;
    this.speedMs = speedMs;
  }
}

// Guards return the checked value so call sites stay one line.

export function assertFiniteNumber(field: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new EngineInputError(field, `${field} must be a finite number (got ${String(value)})`);
  }
  return value;
}

export function assertPositive(field: string, value: unknown): number {
  const x = assertFiniteNumber(field, value);
  if (x <= 0) throw new EngineInputError(field, `${field} must be greater than 0 (got ${x})`);
  return x;
}

export function assertNonNegative(field: string, value: unknown): number {
  const x = assertFiniteNumber(field, value);
  if (x < 0) throw new EngineInputError(field, `${field} must not be negative (got ${x})`);
  return x;
}

/** Closed-open interval [min, max): used for loss coefficients and wake fraction. */
export function assertInHalfOpenRange(field: string, value: unknown, min: number, max: number): number {
  const x = assertFiniteNumber(field, value);
  if (x < min || x >= max) {
    throw new EngineInputError(field, `${field} must be at least ${min} and below ${max} (got ${x})`);
  }
  return x;
}

/** Closed interval [min, max]. */
export function assertInRange(field: string, value: unknown, min: number, max: number, unit = ''): number {
  const x = assertFiniteNumber(field, value);
  if (x < min || x > max) {
    const u = unit ? ` ${unit}` : '';
    throw new EngineInputError(field, `${field} must be between ${min} and ${max}${u} (got ${x})`);
  }
  return x;
}
