/**
 * `npm run balance -- --check-statement FILE.pdf`: takes the plant-month document a signed
 * statement carries, recomputes it with this engine, and compares every figure of the result
 * document the statement carries. Also says whether the signature covers the whole file and
 * verifies. No database, no account: what a verifier or an authority holding the PDF can run.
 */
import { createHash } from "node:crypto";
import { calculate, CalculationInputError } from "@/lib/balance/calculate";
import { Dec } from "@/lib/balance/decimal";
import { toResultDocument } from "@/lib/balance/result";
import { describeIssues, parsePlantMonthText } from "@/lib/balance/schema";
import { ENGINE_VERSION } from "@/lib/balance/version";
import { readEmbeddedFiles } from "./embed";
import { inspectSignedPdf } from "./inspect";

export interface CheckOutcome {
  code: 0 | 1 | 2;
  stdout: string;
  stderr: string;
}

const DECIMAL = /^-?\d+(\.\d+)?([eE][+-]?\d+)?$/;

/** Every leaf of a JSON value by its path (streams[2].kmol), so two documents compare figure by figure. */
function leaves(value: unknown, path = "", out = new Map<string, unknown>()): Map<string, unknown> {
  if (Array.isArray(value)) value.forEach((v, i) => leaves(v, `${path}[${i}]`, out));
  else if (value !== null && typeof value === "object") for (const [k, v] of Object.entries(value)) leaves(v, path ? `${path}.${k}` : k, out);
  else out.set(path, value);
  return out;
}

/** Equal as figures: decimal strings by value (1.50 = 1.5), everything else exactly. */
function same(a: unknown, b: unknown): boolean {
  if (typeof a === "string" && typeof b === "string" && DECIMAL.test(a) && DECIMAL.test(b)) return new Dec(a).eq(b);
  return a === b;
}

/** Keys that say who computed, not what: compared separately. */
const NOT_FIGURES = new Set(["engine"]);

export async function checkStatement(pdf: Buffer, file: string): Promise<CheckOutcome> {
  const fail = (why: string): CheckOutcome => ({ code: 2, stdout: "", stderr: `${file}: ${why}\n` });
  if (pdf.subarray(0, 5).toString("latin1") !== "%PDF-") return fail("not a PDF file");
  let embedded;
  try {
    embedded = await readEmbeddedFiles(pdf);
  } catch (e) {
    return fail(`the PDF cannot be read (${(e as Error).message})`);
  }
  const docFile = embedded.find((f) => f.name.endsWith(".plant-month.json"));
  const resultFile = embedded.find((f) => f.name.endsWith(".result.json"));
  if (!docFile || !resultFile) return fail("carries no plant-month and result documents: not a Synledger statement, or one signed before statements carried their documents");

  const docText = Buffer.from(docFile.bytes).toString("utf8");
  const resultText = Buffer.from(resultFile.bytes).toString("utf8");
  let stated: Record<string, unknown>;
  try {
    stated = JSON.parse(resultText) as Record<string, unknown>;
  } catch {
    return fail(`the attached ${resultFile.name} is not JSON`);
  }
  const parsed = parsePlantMonthText(docText);
  if (!parsed.ok) return fail(`the attached ${docFile.name} is not a valid plant-month document\n${describeIssues(parsed.issues)}`);
  const tolerance = typeof stated.closure_tolerance_pct === "string" && DECIMAL.test(stated.closure_tolerance_pct) ? new Dec(stated.closure_tolerance_pct) : undefined;
  let recomputed: Record<string, unknown>;
  try {
    recomputed = toResultDocument(calculate(parsed.doc, tolerance ? { closureTolerancePct: tolerance } : {})) as unknown as Record<string, unknown>;
  } catch (e) {
    if (e instanceof CalculationInputError) return fail(`the attached document does not compute: ${e.message}`);
    throw e;
  }

  const a = leaves(stated);
  const b = leaves(recomputed);
  const differences: string[] = [];
  for (const path of new Set([...a.keys(), ...b.keys()])) {
    if (NOT_FIGURES.has(path)) continue;
    if (!same(a.get(path), b.get(path))) differences.push(`${path}: the statement says ${JSON.stringify(a.get(path) ?? null)}, recomputed ${JSON.stringify(b.get(path) ?? null)}`);
  }
  const sig = inspectSignedPdf(pdf);
  const sha = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");
  const lines = [
    `${file}`,
    `  plant-month document ${docFile.name}, SHA-256 ${sha(docFile.bytes)}`,
    `  result document ${resultFile.name}, SHA-256 ${sha(resultFile.bytes)}`,
    `  computed by ${String(stated.engine ?? "an engine that did not name itself")}; recomputed by ${ENGINE_VERSION}`,
    sig
      ? `  signature: ${sig.signedDigestOk ? "verifies" : "DOES NOT VERIFY (the file changed after signing)"}; ${sig.coversWholeFile ? "covers the whole file" : "DOES NOT cover the whole file (bytes were added after signing)"}${sig.signerSubject ? `; signed with ${sig.signerSubject}` : ""}`
      : "  signature: none found",
  ];
  const signatureOk = !!sig && sig.signedDigestOk && sig.coversWholeFile;
  if (differences.length === 0) {
    lines.push(`  every figure of the result (${a.size - 1} values) matches the recomputation`);
    return { code: signatureOk ? 0 : 1, stdout: `${lines.join("\n")}\n`, stderr: signatureOk ? "" : "the figures match, but the signature does not hold for this file\n" };
  }
  lines.push(`  ${differences.length} ${differences.length === 1 ? "figure differs" : "figures differ"} from the recomputation:`, ...differences.map((d) => `    ${d}`));
  return { code: 1, stdout: `${lines.join("\n")}\n`, stderr: "" };
}
