import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as download } from "@/app/api/v1/statements/[id]/pdf/route";
import { POST as verify } from "@/app/api/v1/verify/route";
import { CLIENT_ADDRESS_HEADER } from "@/lib/net/forwarded";
import { sha256Hex } from "@/lib/signing/hash";
import { actAs } from "../support/mock-auth";
import { closeTestDb } from "../support/db";
import { createOrg, type FixtureOrg } from "../support/fixtures";
import { testDb } from "../support/db";
import { act, lifecycleOrg, type LifecycleOrg } from "./lifecycle-support";

vi.mock("@/auth", () => import("../support/mock-auth"));

let org: LifecycleOrg;
let stranger: FixtureOrg;
let statementId: string;
let pdf: Buffer;

beforeAll(async () => {
  org = await lifecycleOrg("Verify");
  stranger = await createOrg(testDb(), "Stranger");
  await act(org, "process_engineer", org.estuaryId, "2026-06", "balance");
  await act(org, "environmental_officer", org.estuaryId, "2026-06", "send-for-review");
  statementId = (await act(org, "signatory", org.estuaryId, "2026-06", "sign")).statementId!;
}, 120_000);
afterAll(closeTestDb);

const get = (id: string) => download(new Request(`http://test/api/v1/statements/${id}/pdf`), { params: Promise.resolve({ id }) });

/** A verification request as server.ts passes it on: the caller's address in CLIENT_ADDRESS_HEADER. */
function post(bytes: Buffer | null, address = "192.0.2.1") {
  const form = new FormData();
  if (bytes) form.set("file", new Blob([new Uint8Array(bytes)], { type: "application/pdf" }), "statement.pdf");
  return verify(new Request("http://test/api/v1/verify", { method: "POST", body: form, headers: { [CLIENT_ADDRESS_HEADER]: address } }), { params: Promise.resolve({}) });
}

describe("GET /api/v1/statements/{id}/pdf", () => {
  it("gives any member, the auditor included, the exact signed bytes as an attachment", async () => {
    actAs(org.session("auditor"));
    const res = await get(statementId);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    expect(res.headers.get("content-disposition")).toMatch(/^attachment; filename="estuary-monthly-2026-06-rev1\.pdf"$/);
    pdf = Buffer.from(await res.arrayBuffer());
    expect(res.headers.get("x-content-sha256")).toBe(sha256Hex(pdf));
  });

  it("answers 404 to another organisation and to a malformed id, 401 when signed out", async () => {
    actAs(stranger.session("administrator"));
    expect((await get(statementId)).status).toBe(404);
    actAs(org.session("auditor"));
    expect((await get("not-a-uuid")).status).toBe(404);
    actAs(null);
    expect((await get(statementId)).status).toBe(401);
  });
});

/**
 * Public verification (issue 13): whoever holds a copy checks it without an account and sees the
 * statement's public facts only; 30 requests a minute per address, then 429 with Retry-After.
 * Each test calls from its own address (documentation range, RFC 5737), so their counts do not mix.
 */
describe("POST /api/v1/verify, anonymous", () => {
  it("issued: the public facts of the statement and nothing else of the organisation", async () => {
    actAs(null);
    const res = await post(pdf, "192.0.2.10");
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({
      verdict: "issued",
      sha256: sha256Hex(pdf),
      statement: {
        reference: statementId,
        installation: "Estuary Works",
        operator: "Vellmar Nitrogen Company Limited",
        identifiers: expect.stringContaining("EU ETS permit NM-GHG-0417"),
        kind: "monthly",
        period: "2026-06",
        revision: 1,
        signer: org.members.signatory.name,
        verifyUrl: expect.stringMatching(new RegExp(`/verify/${statementId}$`)),
      },
      supersededBy: null,
    });
    expect(body.headline).toMatch(/^Issued/);
    expect(body.statement.figures.map((f: { label: string }) => f.label)).toContain("Total CO2e, gross");
    // In the order the statement prints them, whatever order the stored jsonb keeps.
    expect(body.statement.figures.map((f: { label: string }) => f.label).slice(0, 4)).toEqual(["Total CO2e, gross", "Total CO2e, net", "Gross CO2", "Net CO2"]);
    // Nothing that identifies the organisation's records or people beyond the signer: no ids of
    // the organisation, site, month or users, no e-mail addresses.
    const text = JSON.stringify(body);
    for (const hidden of [org.id, org.estuaryId, org.members.signatory.id, org.members.signatory.email, org.name]) expect(text).not.toContain(hidden);
  });

  it("altered: one changed byte inside the signed range, with reasons", async () => {
    const tampered = Buffer.from(pdf);
    const at = tampered.indexOf("Estuary Works");
    tampered[at] = "F".charCodeAt(0);
    const body = await (await post(tampered, "192.0.2.11")).json();
    expect(body.verdict).toBe("altered");
    expect(body.statement).toMatchObject({ reference: statementId });
    expect(body.explanation.join(" ")).toMatch(/not byte-for-byte/);
  });

  it("unknown: a plain PDF; a request without a file is refused with the field named", async () => {
    expect((await (await post(Buffer.from("%PDF-1.4\n%%EOF\n"), "192.0.2.12")).json()).verdict).toBe("unknown");
    const res = await post(null, "192.0.2.12");
    expect(res.status).toBe(400);
    expect((await res.json()).error.issues).toEqual([{ path: "file", message: "required" }]);
  });

  it("superseded: once the month is reopened and signed again, the first copy names revision 2", async () => {
    await act(org, "environmental_officer", org.estuaryId, "2026-06", "reopen", { reason: "The authority asked for the vent meter's calibration certificate to be attached." });
    await act(org, "process_engineer", org.estuaryId, "2026-06", "balance");
    await act(org, "environmental_officer", org.estuaryId, "2026-06", "send-for-review");
    const second = (await act(org, "signatory", org.estuaryId, "2026-06", "sign")).statementId!;
    actAs(null);
    const body = await (await post(pdf, "192.0.2.13")).json();
    expect(body).toMatchObject({ verdict: "superseded", statement: { reference: statementId, revision: 1 }, supersededBy: { reference: second, revision: 2 } });
    expect(body.headline).toMatch(/^Superseded: .* revision 2 replaced it/);
  }, 120_000);

  it("the 31st request in a minute from one address is refused with 429 and Retry-After; another address is not", async () => {
    const address = "198.51.100.31";
    for (let i = 0; i < 30; i++) expect((await post(null, address)).status, `request ${i + 1}`).toBe(400);
    const refused = await post(null, address);
    expect(refused.status).toBe(429);
    const retry = Number(refused.headers.get("retry-after"));
    expect(retry).toBeGreaterThanOrEqual(1);
    expect(retry).toBeLessThanOrEqual(60);
    expect((await refused.json()).error.code).toBe("rate_limited");
    expect((await post(null, "198.51.100.32")).status).toBe(400);
  });
});
