// Writes the committed example files from the demo generator:
//   npx tsx lib/demo/write-examples.ts
// tests/unit/demo checks that the committed files equal what this produces.
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { demoPlantMonths, plantMonthJson } from "./scenario";

export const EXAMPLES_DIR = "examples";

/** A deliberately broken document: a purge stream with no fate and a negative quantity. */
export function badExampleJson(): string {
  const doc = JSON.parse(exampleFiles()["estuary-2026-03.json"]);
  const purge = doc.streams.find((s: { id: string }) => s.id === "purge");
  delete purge.fate;
  doc.streams.find((s: { id: string }) => s.id === "nh3").quantity = "-46500";
  return JSON.stringify(doc, null, 2) + "\n";
}

export function exampleFiles(): Record<string, string> {
  const files: Record<string, string> = {
    "estuary-2026-03.json": plantMonthJson(demoPlantMonths("estuary")[2]),
    "estuary-2026-08-feed-drift.json": plantMonthJson(demoPlantMonths("estuary")[7]),
    "dunmoor-2026-07.json": plantMonthJson(demoPlantMonths("dunmoor")[6]),
  };
  return files;
}

export function allExampleFiles(): Record<string, string> {
  return { ...exampleFiles(), "bad-estuary-2026-03.json": badExampleJson() };
}

if (process.argv[1] && /write-examples\.ts$/.test(process.argv[1])) {
  for (const [name, text] of Object.entries(allExampleFiles())) writeFileSync(join(EXAMPLES_DIR, name), text);
  console.log(`wrote ${Object.keys(allExampleFiles()).length} files to ${EXAMPLES_DIR}/`);
}
