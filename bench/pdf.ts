/**
 * Statement PDFs: render (react-pdf) and seal (PKCS#7 with a 3072-bit demo key), monthly and
 * annual, timed separately; the first of each is a warm-up (fonts, JIT) and not counted.
 */
import { performance } from "node:perf_hooks";
import { renderAnnualStatement, renderMonthlyStatement } from "../reports/render";
import { createDemoCertificate } from "../lib/signing/demo-certificate";
import { sealPdf } from "../lib/signing/seal";
import { sampleAnnual, sampleMonthly } from "../tests/unit/signing/sample-models";

export interface PdfFigure {
  label: string;
  renderMs: number;
  sealMs: number;
  bytes: number;
  runs: number;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

async function timeOne(label: string, render: () => Promise<Buffer>, seal: (pdf: Buffer) => Promise<Buffer>, runs: number): Promise<PdfFigure> {
  await seal(await render());
  const renders: number[] = [];
  const seals: number[] = [];
  let bytes = 0;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    const pdf = await render();
    const t1 = performance.now();
    const signed = await seal(pdf);
    seals.push(performance.now() - t1);
    renders.push(t1 - t0);
    bytes = signed.length;
  }
  return { label, renderMs: median(renders), sealMs: median(seals), bytes, runs };
}

export async function timeStatements(runs = 5): Promise<PdfFigure[]> {
  const cert = createDemoCertificate({ commonName: "Bench statements", organisation: "Bench fleet" });
  const seal = (pdf: Buffer) => sealPdf(pdf, cert.p12, cert.passphrase, { reason: "Bench", location: "Bench works", name: "Bench signatory", contactInfo: "bench@bench.example" });
  return [
    await timeOne("monthly statement", () => renderMonthlyStatement(sampleMonthly), seal, runs),
    await timeOne("annual statement", () => renderAnnualStatement(sampleAnnual), seal, runs),
  ];
}
