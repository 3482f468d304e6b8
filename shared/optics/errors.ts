/**
 * The one error the engine throws for impossible or meaningless input. `field` names the input
 * (dotted path, e.g. "mirror.diameterM") so a form can show `message` next to it; `message` is a
 * sentence a person can act on.
 */
export class OpticsInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'OpticsInputError';
    this.field = field;
    Object.setPrototypeOf(this, OpticsInputError.prototype);
  }
}

/** Throws unless `value` is a finite number greater than zero. */
export function requirePositive(field: string, value: unknown, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new OpticsInputError(field, `Enter the ${what} as a number.`);
  }
  if (value <= 0) throw new OpticsInputError(field, `The ${what} must be greater than zero.`);
  return value;
}

/** Throws unless `value` is a finite number (any sign). */
export function requireFinite(field: string, value: unknown, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new OpticsInputError(field, `Enter the ${what} as a number.`);
  }
  return value;
}

/** Throws unless `value` is a finite number at least zero. */
export function requireNonNegative(field: string, value: unknown, what: string): number {
  requireFinite(field, value, what);
  if ((value as number) < 0) throw new OpticsInputError(field, `The ${what} cannot be negative.`);
  return value as number;
}

/** Throws unless `value` is three finite numbers. */
export function requirePoint(field: string, value: unknown, what: string): [number, number, number] {
  if (!Array.isArray(value) || value.length !== 3 || !value.every((c) => typeof c === 'number' && Number.isFinite(c))) {
    throw new OpticsInputError(field, `Enter the ${what} as three numbers (x, y, z in metres).`);
  }
  return value as [number, number, number];
}
