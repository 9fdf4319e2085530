import "server-only";
import type { z } from "zod";
import { LIMITS } from "@/lib/balance/limits";
import { JsonNumber, JsonSyntaxError, readJson, type JsonValue } from "@/lib/balance/json-reader";
import { HttpError } from "@/lib/auth/errors";

/** Largest JSON body any v1 route reads: the plant-month bound (a real file is a few kilobytes). */
export const MAX_BODY_BYTES = LIMITS.fileBytes;

const tooLarge = (max: number) =>
  new HttpError(413, "payload_too_large", `The request body is larger than ${max / 1024 / 1024} MiB (${max} bytes); nothing was read or saved. Send one month per request.`);

/**
 * Reads the body as UTF-8 text, stopping as soon as it passes the limit, so an oversized or
 * endless upload costs us at most the limit in memory, whatever Content-Length claims.
 */
export async function readBodyText(req: Request, max = MAX_BODY_BYTES): Promise<string> {
  const declared = Number(req.headers.get("content-length") ?? "");
  if (Number.isFinite(declared) && declared > max) throw tooLarge(max);
  if (!req.body) return "";
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > max) {
      await reader.cancel();
      throw tooLarge(max);
    }
    chunks.push(value);
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(Buffer.concat(chunks));
  } catch {
    throw new HttpError(400, "invalid_input", "The request body is not UTF-8 text.");
  }
}

/**
 * JSON numbers become their literal text, so `"quantity": 1250.50` keeps every digit on its way
 * to Decimal; only the keys named (counters such as expectedVersion) become JS numbers.
 */
function plain(value: JsonValue, integerKeys: ReadonlySet<string>, key?: string): unknown {
  if (value instanceof JsonNumber) {
    if (key !== undefined && integerKeys.has(key) && /^-?\d{1,15}$/.test(value.text)) return Number(value.text);
    return value.text;
  }
  if (Array.isArray(value)) return value.map((v) => plain(v, integerKeys));
  if (value !== null && typeof value === "object") {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, plain(v, integerKeys, k)]));
  }
  return value;
}

/** Where a string holds U+0000, which PostgreSQL text cannot store: answered with its path, not a 500. */
function nulPath(value: JsonValue, path: string): string | null {
  if (typeof value === "string") return value.includes("\u0000") ? path : null;
  if (value === null || typeof value !== "object" || value instanceof JsonNumber) return null;
  for (const [k, v] of Array.isArray(value) ? value.entries() : Object.entries(value)) {
    const at = typeof k === "number" ? `${path}[${k}]` : path ? `${path}.${k}` : k;
    if (typeof k === "string" && k.includes("\u0000")) return at;
    const found = nulPath(v, at);
    if (found !== null) return found;
  }
  return null;
}

export function parseJsonText(text: string, integerKeys: readonly string[] = []): unknown {
  if (text.trim() === "") throw new HttpError(400, "invalid_json", "The request body is empty; send a JSON object.");
  try {
    const value = readJson(text);
    const nul = nulPath(value, "");
    if (nul !== null) throw new HttpError(400, "invalid_input", "Text in the body contains the NUL character (U+0000), which cannot be stored.", [{ path: nul || "body", message: "remove the NUL character (\\u0000)" }]);
    return plain(value, new Set(integerKeys));
  } catch (err) {
    if (err instanceof JsonSyntaxError) throw new HttpError(400, "invalid_json", `The request body is not valid JSON: ${err.message}.`, [{ path: "", message: err.message }]);
    throw err;
  }
}

/** Body → zod schema; a ZodError reaches errorResponse, which answers 400 with every path. */
export async function readJsonBody<S extends z.ZodType>(req: Request, schema: S, integerKeys: readonly string[] = []): Promise<z.output<S>> {
  return schema.parse(parseJsonText(await readBodyText(req), integerKeys));
}
