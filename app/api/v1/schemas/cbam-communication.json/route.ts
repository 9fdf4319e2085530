import { cbamCommunicationJsonSchema } from "@/lib/ledger/cbam-communication";

/** GET /api/v1/schemas/cbam-communication.json: public, like the API description; a schema holds no data. */
export function GET(): Response {
  return Response.json(cbamCommunicationJsonSchema(), { headers: { "Cache-Control": "public, max-age=300" } });
}
