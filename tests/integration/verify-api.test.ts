import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as download } from "@/app/api/v1/statements/[id]/pdf/route";
import { POST as verify } from "@/app/api/v1/verify/route";
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

function post(bytes: Buffer | null) {
  const form = new FormData();
  if (bytes) form.set("file", new Blob([new Uint8Array(bytes)], { type: "application/pdf" }), "statement.pdf");
  return verify(new Request("http://test/api/v1/verify", { method: "POST", body: form }), { params: Promise.resolve({}) });
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

describe("POST /api/v1/verify", () => {
  it("issued: names site, period, revision, signer and time", async () => {
    actAs(org.session("auditor"));
    const res = await post(pdf);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body).toMatchObject({
      verdict: "issued",
      sha256: sha256Hex(pdf),
      statement: { id: statementId, site: "Estuary Works", period: "2026-06", revision: 1, signer: org.members.signatory.name },
    });
    expect(body.headline).toMatch(/^Issued/);
    expect(body.statement.signedAtText).toMatch(/^\d{4}-\d\d-\d\d \d\d:\d\d UTC$/);
  });

  it("altered: one changed byte inside the signed range is refused with reasons", async () => {
    actAs(org.session("process_engineer"));
    const tampered = Buffer.from(pdf);
    const at = tampered.indexOf("Estuary Works");
    tampered[at] = "F".charCodeAt(0);
    const body = await (await post(tampered)).json();
    expect(body.verdict).toBe("altered");
    expect(body.statement).toMatchObject({ id: statementId });
    expect(body.explanation.join(" ")).toMatch(/not byte-for-byte/);
  });

  it("unknown: another organisation gets no hint, a plain file is unknown", async () => {
    actAs(stranger.session("auditor"));
    expect((await (await post(pdf)).json()).verdict).toBe("unknown");
    actAs(org.session("auditor"));
    expect((await (await post(Buffer.from("%PDF-1.4\n%%EOF\n"))).json()).verdict).toBe("unknown");
  });

  it("refuses a request without a file with the field named, and the signed-out", async () => {
    actAs(org.session("auditor"));
    const res = await post(null);
    expect(res.status).toBe(400);
    expect((await res.json()).error.issues).toEqual([{ path: "file", message: "required" }]);
    actAs(null);
    expect((await post(pdf)).status).toBe(401);
  });
});
