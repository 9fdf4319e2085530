// Stands in for the "server-only" package under vitest, which runs outside React's server build.
export {};
