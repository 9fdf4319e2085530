import { readFileSync } from "node:fs";
import path from "node:path";
import { Font } from "@react-pdf/renderer";
import { woffToSfnt } from "./woff-to-sfnt";

/**
 * IBM Plex from public/fonts. WOFF, not WOFF2 (react-pdf cannot read WOFF2), and absolute
 * paths from the project root, which is the working directory of Next, tsx and vitest alike.
 * Each WOFF is unpacked and handed over as a data URL because fontkit cannot read Plex Mono's
 * WOFF directly (see woff-to-sfnt.ts).
 */
let registered = false;

export function registerStatementFonts(root = process.cwd()): void {
  if (registered) return;
  const file = (name: string) =>
    "data:font/ttf;base64," + woffToSfnt(readFileSync(path.join(root, "public", "fonts", name))).toString("base64");
  Font.register({
    family: "Plex Sans",
    fonts: [
      { src: file("ibm-plex-sans-latin-400-normal.woff"), fontWeight: 400 },
      { src: file("ibm-plex-sans-latin-500-normal.woff"), fontWeight: 500 },
      { src: file("ibm-plex-sans-latin-600-normal.woff"), fontWeight: 600 },
    ],
  });
  Font.register({
    family: "Plex Mono",
    fonts: [
      { src: file("ibm-plex-mono-latin-400-normal.woff"), fontWeight: 400 },
      { src: file("ibm-plex-mono-latin-500-normal.woff"), fontWeight: 500 },
    ],
  });
  // Numbers, meter tags and ids must never be split across lines with a hyphen.
  Font.registerHyphenationCallback((word) => [word]);
  registered = true;
}
