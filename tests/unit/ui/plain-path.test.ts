/** Problem locations in the pages' words (common practice, no source: this is our own wording). */
import { describe, expect, it } from "vitest";
import { plainIssue, plainPath, sentence } from "@/lib/plain-path";

describe("plain paths", () => {
  it.each([
    ["balances.carbon", "Carbon balance"],
    ["streams[2].quantity", "Stream purge: quantity"],
    ["streams[9].unit", "Stream no. 10: unit"],
    ["analyses.estuary-grid-gas.components", "Analysis estuary-grid-gas: components"],
    ["analyses.estuary-grid-gas.components.CH4", "Analysis estuary-grid-gas: component CH4"],
    ["analyses[0].components", "Analysis no. 1: components"],
    ["readings[1].quantity", "Reading fuel: quantity"],
    ["readings.nh3", "Reading of nh3"],
    ["method.factor_set", "Factor set"],
    ["", "The document"],
    ["something.else", "something › else"],
  ])("%s → %s", (path, words) => {
    expect(plainPath(path, ["feed", "fuel", "purge"])).toBe(words);
  });

  it("writes a message as a sentence", () => {
    expect(sentence("quantity must be a number")).toBe("Quantity must be a number.");
    expect(sentence("Done.")).toBe("Done.");
    expect(plainIssue("balances.carbon", "closure −2.59 % beyond ±2 %")).toBe("Carbon balance: closure −2.59 % beyond ±2 %.");
  });
});
