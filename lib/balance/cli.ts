// CLI: npm run balance -- FILE.json [--json] [--tolerance PCT] [--no-reconcile]
// Invalid input: exit 2, nothing on stdout, the JSON path and the reason on stderr.
// The argument parser is a small table so `--year FILE1 FILE2 ...` can be added as a mode later.
import { readFileSync } from "node:fs";
import { CalculationInputError, calculate } from "./calculate";
import { Dec } from "./decimal";
import { formatReport } from "./report";
import { toResultDocument } from "./result";
import { describeIssues, parsePlantMonthText } from "./schema";

export interface CliArgs {
  mode: "month"; // "year" to come: several files rolled up
  files: string[];
  json: boolean;
  tolerancePct: Dec | null;
  reconcile: boolean;
}

export class UsageError extends Error {}

export const USAGE = "usage: npm run balance -- FILE.json [--json] [--tolerance PCT] [--no-reconcile]";

export function parseArgs(argv: string[]): CliArgs {
  const args: CliArgs = { mode: "month", files: [], json: false, tolerancePct: null, reconcile: true };
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === "--json") args.json = true;
    else if (a === "--no-reconcile") args.reconcile = false;
    else if (a === "--tolerance") {
      const v = argv[++i];
      if (!v || !/^\d+(\.\d+)?$/.test(v)) throw new UsageError("--tolerance needs a percentage, e.g. --tolerance 2.5");
      args.tolerancePct = new Dec(v);
    } else if (a.startsWith("--")) throw new UsageError(`unknown option ${a}`);
    else args.files.push(a);
  }
  if (args.files.length !== 1) throw new UsageError("give exactly one plant-month file");
  return args;
}

export interface CliOutcome {
  code: number;
  stdout: string;
  stderr: string;
}

/** The whole CLI as a function (tests call it directly; main() only does the I/O). */
export function runCli(argv: string[], read: (file: string) => string = (p) => readFileSync(p, "utf8")): CliOutcome {
  let args: CliArgs;
  try {
    args = parseArgs(argv);
  } catch (e) {
    if (e instanceof UsageError) return { code: 2, stdout: "", stderr: `${e.message}\n${USAGE}\n` };
    throw e;
  }
  const file = args.files[0];
  let text: string;
  try {
    text = read(file);
  } catch (e) {
    return { code: 2, stdout: "", stderr: `${file}: cannot read file (${(e as Error).message})\n` };
  }
  const parsed = parsePlantMonthText(text);
  if (!parsed.ok) return { code: 2, stdout: "", stderr: `${file}: invalid plant-month document\n${describeIssues(parsed.issues)}\n` };
  try {
    const result = calculate(parsed.doc, {
      reconcile: args.reconcile,
      ...(args.tolerancePct ? { closureTolerancePct: args.tolerancePct } : {}),
    });
    const stdout = args.json ? JSON.stringify(toResultDocument(result), null, 2) + "\n" : formatReport(result);
    return { code: 0, stdout, stderr: "" };
  } catch (e) {
    if (e instanceof CalculationInputError) return { code: 2, stdout: "", stderr: `${file}: invalid plant-month document\n${e.message}\n` };
    throw e;
  }
}

const isMain = process.argv[1] && /cli\.ts$/.test(process.argv[1]);
if (isMain) {
  const { code, stdout, stderr } = runCli(process.argv.slice(2));
  if (stdout) process.stdout.write(stdout);
  if (stderr) process.stderr.write(stderr);
  process.exitCode = code;
}
