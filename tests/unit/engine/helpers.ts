// Shared by the engine acceptance tests: the CLI as users run it (a tsx process), and
// plant-month files written to a temporary directory.
import { execFile } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

export interface Run {
  code: number;
  stdout: string;
  stderr: string;
}

export function runCliProcess(args: string[]): Promise<Run> {
  return new Promise((resolve) => {
    execFile("node_modules/.bin/tsx", ["lib/balance/cli.ts", ...args], { maxBuffer: 64 * 1024 * 1024 }, (err, stdout, stderr) =>
      resolve({ code: err ? ((err as { code?: number }).code ?? 1) : 0, stdout, stderr }),
    );
  });
}

/** Writes each text to a fresh temporary directory; returns the paths in the given order. */
export function writeTemp(prefix: string, files: Record<string, string>): string[] {
  const dir = mkdtempSync(join(tmpdir(), `synledger-${prefix}-`));
  return Object.entries(files).map(([name, text]) => {
    const path = join(dir, name);
    writeFileSync(path, text);
    return path;
  });
}
