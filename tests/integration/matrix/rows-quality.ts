import type { MatrixRow } from "./types";

/** Routes added for the quality gates: the health check is public and reads no data. */
export const qualityRows: MatrixRow[] = [
  {
    id: "GET /api/v1/health",
    allowed: "public",
    call: async () => (await import("@/app/api/v1/health/route")).GET(),
  },
];
