// One place decides what counts as a usable input, so every module returns
// null (never 0 or NaN) for the same missing or meaningless values.

/** A finite number greater than zero: tank sizes, consumption, power, mass. */
export function isPositive(value: unknown): value is number {
  return typeof value === "number" && Number.isFinite(value) && value > 0;
}

/** A finite number of zero or more: distances and odometer readings, where 0 is a real reading. */
export function isNonNegative(value: unknown): value is number {
  return typeof value === "number" && Number.isFinite(value) && value >= 0;
}

export function isNonEmptyString(value: unknown): value is string {
  return typeof value === "string" && value.trim().length > 0;
}
