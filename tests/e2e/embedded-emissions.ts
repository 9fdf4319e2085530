/**
 * Browser test of the communication of embedded emissions (issue 14), called from run.ts: the
 * officer opens the year's CBAM figures, prepares the communication for January to March with a
 * shipped quantity, the signatory signs it, and both its PDF (sealed: pdfsig says valid) and its
 * JSON (synledger.cbam-communication/1, the shipment stated) download. Screenshots at 1440 and
 * 390 px. Re-runnable: each run signs a new revision of the same period.
 */
import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { pageAsRole, type E2eKit } from "./lifecycle";

export async function embeddedEmissionsChecks(k: E2eKit): Promise<void> {
  const assert: E2eKit["assert"] = k.assert;
  const pageAs = (role: string, width?: number) => pageAsRole(k, role, width);
  let prepared = "";
  const officer = await pageAs("environmental_officer", 1440);

  await k.check("officer opens the year's embedded emissions and prepares the communication for January–March", async () => {
    await officer.goto(`${k.base}/`);
    const card = officer.locator("section", { has: officer.getByRole("heading", { name: /Estuary Works/ }) }).first();
    const href = (await card.getByRole("link", { name: "Trends" }).getAttribute("href")) ?? "";
    const siteId = /\/sites\/([^/?]+)\/trends/.exec(href)?.[1];
    assert(siteId, `no Estuary trends link on the overview (${href})`);
    await officer.goto(`${k.base}/sites/${siteId}/years/2026`);
    await officer.getByRole("heading", { name: "CBAM embedded emissions" }).waitFor();
    assert(await officer.getByRole("heading", { name: "EU emissions trading: monitoring check" }).isVisible(), "monitoring check missing");
    await k.shot(officer, "cbam-01-year-1440");
    await officer.getByRole("link", { name: "prepare and sign it" }).click();
    await officer.getByRole("heading", { name: /Embedded emissions: communication to importers/ }).waitFor();
    await officer.getByLabel("First month").fill("2026-01");
    await officer.getByLabel("Last month").fill("2026-03");
    await officer.getByLabel(/Shipped, t NH3/).fill("12000");
    await officer.getByRole("button", { name: "Prepare" }).click();
    await officer.getByRole("heading", { name: /^Draft, January 2026 to March 2026/ }).waitFor();
    assert(await officer.getByText("Specific embedded emissions, total").isVisible(), "draft figures missing");
    assert(!(await officer.getByRole("button", { name: "Sign and issue this communication" }).count()), "the officer was offered the signature");
    prepared = officer.url();
    await k.shot(officer, "cbam-02-draft-officer-1440");
  });

  const signatory = await pageAs("signatory");
  let pdf = "";
  await k.check("signatory signs the prepared communication; its PDF is sealed and its JSON states the shipment", async () => {
    assert(prepared, "nothing prepared");
    await signatory.goto(prepared);
    await signatory.getByRole("button", { name: "Sign and issue this communication" }).click();
    await signatory.getByText(/^Signed: the communication of embedded emissions, 2026-01 to 2026-03/).waitFor({ timeout: 60_000 });
    await signatory.reload();
    const row = signatory.locator("tr", { hasText: "January 2026 to March 2026" }).first();
    await row.waitFor();
    const [pdfDownload] = await Promise.all([signatory.waitForEvent("download"), row.getByRole("link", { name: "PDF" }).click()]);
    pdf = `${k.out}/cbam-communication.pdf`;
    await pdfDownload.saveAs(pdf);
    assert(readFileSync(pdf).subarray(0, 5).toString() === "%PDF-", "download is not a PDF");
    const sig = spawnSync("pdfsig", [pdf], { encoding: "utf8" });
    assert(`${sig.stdout}${sig.stderr}`.includes("Signature is Valid"), "pdfsig does not find a valid signature");
    const [jsonDownload] = await Promise.all([signatory.waitForEvent("download"), row.getByRole("link", { name: "JSON" }).click()]);
    const jsonPath = `${k.out}/cbam-communication.json`;
    await jsonDownload.saveAs(jsonPath);
    const doc = JSON.parse(readFileSync(jsonPath, "utf8"));
    assert(doc.format === "synledger.cbam-communication/1", `format ${doc.format}`);
    assert(doc.shipment?.quantity_t === "12000", `shipment ${JSON.stringify(doc.shipment)}`);
    assert(doc.period.from === "2026-01" && doc.period.to === "2026-03", "period");
    await k.shot(signatory, "cbam-03-signed-1280");
  });

  await k.check("the communication page works at phone width (390 px): no sideways scroll", async () => {
    const phone = await pageAs("environmental_officer", 390);
    await phone.goto(prepared);
    await phone.getByRole("heading", { name: /^Draft, January 2026/ }).waitFor();
    const over = await phone.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    assert(over <= 1, `the page scrolls sideways by ${over} px`);
    await k.shot(phone, "cbam-04-draft-390");
    await phone.context().close();
  });
  await officer.context().close();
  await signatory.context().close();
}
