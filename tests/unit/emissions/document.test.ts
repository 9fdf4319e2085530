import { describe, expect, it } from "vitest";
import { computeEmissions, toEmissionsDocument } from "../../../lib/emissions/index";
import { plant } from "./fixtures";

function leaves(v: unknown, path = "$"): [string, unknown][] {
  if (v !== null && typeof v === "object") {
    return Object.entries(v as object).flatMap(([k, x]) => leaves(x, Array.isArray(v) ? `${path}[${k}]` : `${path}.${k}`));
  }
  return [[path, v]];
}

describe("toEmissionsDocument", () => {
  const doc = toEmissionsDocument(computeEmissions(plant()));
  it("writes every engineering number as a plain decimal string", () => {
    const numbers = leaves(doc).filter(([p, v]) => typeof v === "number" && !p.endsWith(".tier"));
    expect(numbers).toEqual([]);
    expect(doc.emissions).toMatchObject({ co2_t: "77000", co2e_t: "77021.8", transferred_co2_t: "40000", net_co2e_t: "37021.8" });
    const strings = leaves(doc).filter(([, v]) => typeof v === "string").map(([, v]) => v as string);
    expect(strings.some((s) => /^-?\d+(\.\d+)?e[-+]?\d+$/i.test(s))).toBe(false); // never exponent notation
  });
  it("uses snake_case keys and is identical from run to run", () => {
    const keys = leaves(doc).map(([p]) => p.split(".").pop()!.replace(/\[\d+\]$/, ""));
    expect(keys.filter((k) => /[A-Z-]/.test(k))).toEqual([]);
    expect(JSON.stringify(toEmissionsDocument(computeEmissions(plant())))).toBe(JSON.stringify(doc));
    expect(doc.format).toBe("synledger.emissions/1");
  });
});
