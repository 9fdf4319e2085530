/**
 * A well-formed UUID. Ids from URLs are checked with it before any query, so a malformed one
 * answers "not found" instead of reaching PostgreSQL, which would reject it as an error.
 */
export const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
