/**
 * The project's own lint rules can fail: ESLint (the project's eslint.config.mjs) run on a few
 * lines as if they stood in a given file.
 */
import { ESLint } from "eslint";
import { describe, expect, it } from "vitest";

const eslint = new ESLint({ cwd: process.cwd() });
const messagesOf = async (filePath: string, code: string) => (await eslint.lintText(code, { filePath }))[0].messages.map((m) => `${m.ruleId}: ${m.message}`);

describe("the engine stays pure (no-restricted-imports on lib/balance and lib/emissions)", () => {
  it.each([
    ["lib/balance/probe.ts", 'import { headers } from "next/headers";\nexport const h = headers;\n', "web framework"],
    ["lib/emissions/probe.ts", 'import { getDb } from "@/db";\nexport const d = getDb;\n', "never reads the database"],
    ["lib/balance/probe.ts", 'import { sql } from "drizzle-orm";\nexport const s = sql;\n', "never reads the database"],
    ["lib/emissions/probe.ts", 'import { useState } from "react";\nexport const u = useState;\n', "web framework"],
  ])("refuses %s importing what its second line names", async (file, code, why) => {
    const messages = await messagesOf(file, code);
    expect(messages.some((m) => m.startsWith("no-restricted-imports") && m.includes(why)), messages.join("\n")).toBe(true);
  });

  it("lets the same import stand outside the engine, and the engine import its own modules", async () => {
    expect(await messagesOf("lib/ledger/probe.ts", 'import { headers } from "next/headers";\nexport const h = headers;\n')).toEqual([]);
    expect(await messagesOf("lib/balance/probe.ts", 'import { Dec } from "./decimal";\nexport const d = Dec;\n')).toEqual([]);
  });
});

describe("no pattern is built at run time (no-restricted-syntax)", () => {
  it("refuses new RegExp outside the tests", async () => {
    const messages = await messagesOf("lib/ledger/probe.ts", "export const r = (s: string) => new RegExp(s);\n");
    expect(messages.some((m) => m.startsWith("no-restricted-syntax"))).toBe(true);
  });
});
