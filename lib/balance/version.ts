/**
 * Which engine computed a frozen month. Raise it whenever a change to lib/balance or
 * lib/emissions can change any figure of a result document (a corrected table value, a new
 * rule): a snapshot names the version that produced it, and `--check-statement` says so when it
 * recomputes a statement with a different one.
 */
export const ENGINE_VERSION = "synledger-engine/2026.12.2";
