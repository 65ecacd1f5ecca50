/** Throws a RangeError unless `value` is a finite number > 0 (input guard for the engine's public functions). */
export function assertPositive(name: string, value: number): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a finite number > 0, got ${value}`);
  }
}
