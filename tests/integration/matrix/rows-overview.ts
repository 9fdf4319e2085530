import { ROLES } from "@/lib/auth/roles";
import { type MatrixContext, type MatrixRow, matrixRequest } from "./types";

/** Rows of the overview's routes: the year series, the year export and the annual signature. */
const req = (url = "http://matrix/") => matrixRequest(url, { method: "GET" });
const params = <P>(p: P) => ({ params: Promise.resolve(p) });
const year = ({ target }: MatrixContext) => ({ siteId: target.siteId, year: "2026" });

export const overviewRows: MatrixRow[] = [
  {
    id: "GET /api/v1/sites/[siteId]/years/[year]/series",
    allowed: ROLES,
    call: async (c) => (await import("@/app/api/v1/sites/[siteId]/years/[year]/series/route")).GET(req(), params(year(c))),
  },
  {
    id: "GET /api/v1/sites/[siteId]/years/[year]/export",
    allowed: ROLES,
    call: async (c) => (await import("@/app/api/v1/sites/[siteId]/years/[year]/export/route")).GET(req("http://matrix/?format=csv"), params(year(c))),
  },
  {
    // The fixture site has no months: the communication of an empty period is still an answer.
    id: "GET /api/v1/sites/[siteId]/embedded-emissions",
    allowed: ROLES,
    call: async ({ target }) =>
      (await import("@/app/api/v1/sites/[siteId]/embedded-emissions/route")).GET(req("http://matrix/?from=2026-01&to=2026-03"), params({ siteId: target.siteId })),
  },
  {
    // The fixture site has no months: the signatory's call is refused for that reason, past the gate.
    id: "app/(app)/sites/[siteId]/embedded-emissions/actions.ts#signCommunicationAction",
    allowed: ["signatory"],
    call: async ({ target }) => {
      const { signCommunicationAction } = await import("@/app/(app)/sites/[siteId]/embedded-emissions/actions");
      const form = new FormData();
      form.set("siteId", target.siteId);
      form.set("from", "2026-01");
      form.set("to", "2026-03");
      return signCommunicationAction(null, form);
    },
  },
  { id: "GET /api/v1/schemas/cbam-communication.json", allowed: "public", call: async () => (await import("@/app/api/v1/schemas/cbam-communication.json/route")).GET() },
  {
    // The fixture site has no months, so the signatory's call is refused for that reason: past the gate.
    id: "app/(app)/sites/[siteId]/years/[year]/actions.ts#signAnnualStatementAction",
    allowed: ["signatory"],
    call: async ({ target }) => {
      const { signAnnualStatementAction } = await import("@/app/(app)/sites/[siteId]/years/[year]/actions");
      const form = new FormData();
      form.set("siteId", target.siteId);
      form.set("year", "2026");
      return signAnnualStatementAction(null, form);
    },
  },
];
