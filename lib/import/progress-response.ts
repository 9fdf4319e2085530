import "server-only";
import { errorResponse } from "@/lib/auth/guard";

export type ImportPhase = "parse" | "validate" | "commit";
export interface ProgressEvent {
  type: "progress";
  phase: ImportPhase;
  done: number;
  total: number;
}
export type Emit = (e: Omit<ProgressEvent, "type">) => Promise<void>;

export const NDJSON = "application/x-ndjson";

/** Lets the event loop run, so a line written to the stream leaves before the next batch of work. */
const pause = () => new Promise<void>((resolve) => setImmediate(resolve));

/**
 * A long import answers in one of two ways. A client that asks for `application/x-ndjson` (the
 * wizard) gets progress lines while the work runs, then one `{"type":"result","status":…,"body":…}`
 * line; the HTTP status is 200 because it is sent before the outcome is known. Any other client
 * (API scripts, tests) gets the plain JSON body with the real status code.
 */
export async function progressResponse(req: Request, work: (emit: Emit) => Promise<unknown>): Promise<Response> {
  if (!(req.headers.get("accept") ?? "").includes(NDJSON)) {
    try {
      return Response.json(await work(async () => {}));
    } catch (err) {
      return errorResponse(err);
    }
  }
  const encoder = new TextEncoder();
  const stream = new TransformStream<Uint8Array, Uint8Array>();
  const writer = stream.writable.getWriter();
  // Writes are not awaited: a reader that went away (tab closed) must not abort a commit half-way
  // through its transaction; the work finishes or fails on its own merits. Lines are few and small.
  const line = (value: unknown) => void writer.write(encoder.encode(`${JSON.stringify(value)}\n`)).catch(() => {});
  void (async () => {
    try {
      const body = await work(async (e) => {
        line({ type: "progress", ...e });
        await pause();
      });
      line({ type: "result", status: 200, body });
    } catch (err) {
      const res = errorResponse(err);
      line({ type: "result", status: res.status, body: await res.json() });
    } finally {
      await writer.close().catch(() => {});
    }
  })();
  // no-transform: compression would hold the lines back until the end.
  return new Response(stream.readable, { headers: { "content-type": `${NDJSON}; charset=utf-8`, "cache-control": "no-store, no-transform", "x-accel-buffering": "no" } });
}
