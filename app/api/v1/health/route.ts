/**
 * GET /api/v1/health: answers {ok:true} without a session and without touching the database,
 * so a load balancer can tell "the process serves requests" apart from "PostgreSQL is down",
 * and `npm run bench` has a baseline for what the framework alone costs per request.
 */
export const dynamic = "force-dynamic";

export function GET(): Response {
  return Response.json({ ok: true }, { headers: { "Cache-Control": "no-store" } });
}
