// Input errors found after the schema: the document is well formed, yet cannot be calculated.
// Kept in its own module so calculate.ts and result.ts can both raise it without a cycle.

/** A figure that passed the schema but cannot be used (e.g. GJ on a gas with no calorific value, an unknown factor set). */
export class CalculationInputError extends Error {
  constructor(readonly path: string, readonly reason: string) {
    super(`${path}: ${reason}`);
  }
}
