import { openApiDocument } from "@/lib/api/openapi";

/** GET /api/v1/openapi.json: public, like any published API description; it holds no data. */
export function GET(): Response {
  return Response.json(openApiDocument, { headers: { "Cache-Control": "public, max-age=300" } });
}
