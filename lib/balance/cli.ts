// CLI: npm run balance -- FILE.json [--json] [--tolerance PCT] [--no-reconcile]
//      npm run balance -- --year FILE1.json FILE2.json … [--json]
//      npm run balance -- --check-statement FILE.pdf   (recomputes a signed statement from the documents it carries)
// Invalid input: exit 2, nothing on stdout, the file, the JSON path and the reason on stderr.
// Year mode reads every file before printing anything, so one bad month never yields a partial total.
import { readFileSync, statSync } from "node:fs";
import { CalculationInputError, calculate } from "./calculate";
import { Dec } from "./decimal";
import { formatReport } from "./report";
import { formatYearReport } from "./report-year";
import { toResultDocument } from "./result";
import { LIMITS, tooLargeReason } from "./limits";
import { describeIssues, parsePlantMonthText } from "./schema";
import { type LoadedMonth, rollUp, toYearDocument, yearInputProblem } from "./year";

export interface CliArgs {
  mode: "month" | "year";
  files: string[];
  json: boolean;
  tolerancePct: Dec | null;
  reconcile: boolean;
}

export class UsageError extends Error {}

export const USAGE = [
  "usage: npm run balance -- FILE.json [--json] [--tolerance PCT] [--no-reconcile]",
  "       npm run balance -- --year FILE1.json FILE2.json ... [--json] [--tolerance PCT] [--no-reconcile]",
  "       npm run balance -- --check-statement FILE.pdf",
].join("\n");

/** Statement PDFs are larger than plant-month files (fonts, the embedded documents); 20 MiB as the verify page allows. */
const MAX_STATEMENT_BYTES = 20 * 1024 * 1024;

/**
 * --check-statement FILE.pdf: exit 0 when every figure matches and the signature covers the
 * whole file, 1 when not (each difference listed), 2 for a file that cannot be checked.
 */
export async function runCheckStatement(argv: string[], read: (p: string) => Buffer = (p) => readFileSync(p)): Promise<CliOutcome> {
  const files = argv.filter((a) => a !== "--check-statement");
  if (files.length !== 1 || files[0].startsWith("--")) return fail(`--check-statement needs exactly one PDF file\n${USAGE}\n`);
  const file = files[0];
  let pdf: Buffer;
  try {
    const size = statSync(file).size;
    if (size > MAX_STATEMENT_BYTES) return fail(`${file}: ${size} bytes, more than the ${MAX_STATEMENT_BYTES} bytes a statement may take\n`);
    pdf = read(file);
  } catch (e) {
    return fail(`${file}: cannot read file (${(e as Error).message})\n`);
  }
  // Loaded only here: the engine itself does not depend on the signing code.
  const { checkStatement } = await import("../signing/check-statement");
  return checkStatement(pdf, file);
}

export function parseArgs(argv: string[]): CliArgs {
  const args: CliArgs = { mode: "month", files: [], json: false, tolerancePct: null, reconcile: true };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "--json") args.json = true;
    else if (a === "--year") args.mode = "year";
    else if (a === "--no-reconcile") args.reconcile = false;
    else if (a === "--tolerance") {
      const v = argv[++i];
      if (!v || !/^\d+(\.\d+)?$/.test(v)) throw new UsageError("--tolerance needs a percentage, e.g. --tolerance 2.5");
      args.tolerancePct = new Dec(v);
    } else if (a.startsWith("--")) throw new UsageError(`unknown option ${a}`);
    else args.files.push(a);
  }
  if (args.mode === "month" && args.files.length !== 1) throw new UsageError("give exactly one plant-month file (or --year and several)");
  if (args.mode === "year" && args.files.length === 0) throw new UsageError("--year needs the plant-month files of one site and year");
  return args;
}

export interface CliOutcome {
  code: number;
  stdout: string;
  stderr: string;
}

type Read = (file: string) => string;
const fail = (stderr: string): CliOutcome => ({ code: 2, stdout: "", stderr });

/** Reads, validates and calculates one file; any problem comes back as the stderr text naming the file. */
export function loadMonth(file: string, args: CliArgs, read: Read): LoadedMonth | { error: string } {
  let text: string;
  try {
    text = read(file);
  } catch (e) {
    return { error: `${file}: cannot read file (${(e as Error).message})\n` };
  }
  const parsed = parsePlantMonthText(text);
  if (!parsed.ok) return { error: `${file}: invalid plant-month document\n${describeIssues(parsed.issues)}\n` };
  try {
    const result = calculate(parsed.doc, {
      reconcile: args.reconcile,
      ...(args.tolerancePct ? { closureTolerancePct: args.tolerancePct } : {}),
    });
    return { file, doc: parsed.doc, result };
  } catch (e) {
    if (e instanceof CalculationInputError) return { error: `${file}: invalid plant-month document\n${e.message}\n` };
    throw e;
  }
}

function runYear(args: CliArgs, read: Read): CliOutcome {
  const months: LoadedMonth[] = [];
  for (const file of args.files) {
    const m = loadMonth(file, args, read);
    if ("error" in m) return fail(m.error);
    months.push(m);
  }
  const problem = yearInputProblem(months);
  if (problem) return fail(`${problem.file}: cannot be rolled up with the other files\n${problem.path}: ${problem.reason}\n`);
  const y = rollUp(months);
  return { code: 0, stdout: args.json ? JSON.stringify(toYearDocument(y), null, 2) + "\n" : formatYearReport(y), stderr: "" };
}

/** The whole CLI as a function (tests call it directly; main() only does the I/O). */
/** Refuses a file over the plant-month bound before reading a byte of it. */
export function readBounded(path: string): string {
  const size = statSync(path).size;
  if (size > LIMITS.fileBytes) throw new Error(tooLargeReason(size));
  return readFileSync(path, "utf8");
}

export function runCli(argv: string[], read: Read = readBounded): CliOutcome {
  let args: CliArgs;
  try {
    args = parseArgs(argv);
  } catch (e) {
    if (e instanceof UsageError) return fail(`${e.message}\n${USAGE}\n`);
    throw e;
  }
  if (args.mode === "year") return runYear(args, read);
  const m = loadMonth(args.files[0], args, read);
  if ("error" in m) return fail(m.error);
  const stdout = args.json ? JSON.stringify(toResultDocument(m.result), null, 2) + "\n" : formatReport(m.result);
  return { code: 0, stdout, stderr: "" };
}

const isMain = process.argv[1] && /cli\.ts$/.test(process.argv[1]);
if (isMain) {
  const argv = process.argv.slice(2);
  void (argv.includes("--check-statement") ? runCheckStatement(argv) : Promise.resolve(runCli(argv))).then(({ code, stdout, stderr }) => {
    if (stdout) process.stdout.write(stdout);
    if (stderr) process.stderr.write(stderr);
    process.exitCode = code;
  });
}
