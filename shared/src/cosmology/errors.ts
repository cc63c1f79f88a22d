/**
 * The engine's one error type: a question the model cannot answer (a redshift below zero,
 * a lookback time longer than the age of the universe, a distance beyond the horizon).
 * Its message is written for the manuscript's author.
 */
export class CosmologyRangeError extends RangeError {
  constructor(message: string) {
    super(message);
    this.name = 'CosmologyRangeError';
  }
}

/** Throws unless z is a finite number ≥ 0. */
export function checkRedshift(z: number, name = 'redshift'): void {
  if (!(z >= 0) || !Number.isFinite(z)) throw new CosmologyRangeError(`${name} must be a finite number ≥ 0, got ${z}`);
}
