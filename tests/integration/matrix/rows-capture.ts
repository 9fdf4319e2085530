import { randomUUID } from "node:crypto";
import { and, eq } from "drizzle-orm";
import { sites, streams } from "@/db/schema";
import { SITE_DEFAULTS } from "@/lib/validations/site";
import { STREAM_DEFAULTS } from "@/lib/validations/stream";
import type { MatrixContext, MatrixRow } from "./types";

/** Rows of the site set-up and month-form server actions. */
const tag = () => randomUUID().slice(0, 8);
const actions = () => import("@/app/(app)/settings/sites/actions");
const monthActions = () => import("@/app/(app)/sites/[siteId]/months/[month]/actions");

async function aStream({ db, target }: MatrixContext): Promise<string> {
  const [row] = await db
    .insert(streams)
    .values({ siteId: target.siteId, key: `nh3-${tag()}`, name: "Ammonia", kind: "ammonia", unit: "t" })
    .returning({ id: streams.id });
  return row.id;
}

const streamInput = () => ({ ...STREAM_DEFAULTS, key: `feed-${tag()}`, name: "Feed gas", kind: "feed-gas" as const, unit: "Sm3", analysisKey: "grid-gas" });

export const captureRows: MatrixRow[] = [
  {
    id: "app/(app)/settings/sites/actions.ts#createSite",
    allowed: ["administrator"],
    async call() {
      const code = `m-${tag()}`;
      return Object.assign({}, await (await actions()).createSite({ ...SITE_DEFAULTS, name: "Matrix works", code }), { code });
    },
    // A site is always made in the creator's own organisation: none may appear in target's.
    async crossOrgSeesNothing(result, { db, target }) {
      const { code } = result as { code: string };
      return (await db.select().from(sites).where(and(eq(sites.organisationId, target.id), eq(sites.code, code)))).length === 0;
    },
  },
  {
    id: "app/(app)/settings/sites/actions.ts#editSite",
    allowed: ["administrator"],
    call: async ({ target }) => (await actions()).editSite(target.siteId, { ...SITE_DEFAULTS, name: "Renamed works", code: `r-${tag()}` }),
  },
  {
    id: "app/(app)/settings/sites/actions.ts#saveInstallation",
    allowed: ["administrator"],
    call: async ({ target }) =>
      (await actions()).saveInstallation(target.siteId, {
        operatorName: `Matrix operator ${tag()}`,
        identifiers: [{ scheme: "EU ETS permit", identifier: `M-${tag()}` }],
        address: "1 Matrix Road",
        competentAuthority: "Matrix Agency",
        monitoringPlanRef: "MP-1",
        monitoringPlanVersion: "1",
        contactName: "Matrix Contact",
        contactEmail: "contact@matrix.example",
        contactPhone: "",
      }),
  },
  {
    id: "app/(app)/settings/sites/actions.ts#archiveSite",
    allowed: ["administrator"],
    call: async ({ target }) => (await actions()).archiveSite(target.siteId, true),
  },
  {
    id: "app/(app)/settings/sites/actions.ts#createStream",
    allowed: ["administrator"],
    call: async ({ target }) => (await actions()).createStream(target.siteId, streamInput()),
  },
  {
    id: "app/(app)/settings/sites/actions.ts#editStream",
    allowed: ["administrator"],
    call: async (ctx) => (await actions()).editStream(ctx.target.siteId, await aStream(ctx), { ...STREAM_DEFAULTS, key: `k-${tag()}`, name: "Ammonia", kind: "ammonia", unit: "t" }),
  },
  {
    id: "app/(app)/settings/sites/actions.ts#archiveStream",
    allowed: ["administrator"],
    call: async (ctx) => (await actions()).archiveStream(ctx.target.siteId, await aStream(ctx), true),
  },
  {
    id: "app/(app)/sites/[siteId]/months/[month]/actions.ts#saveMonthForm",
    allowed: ["process_engineer"],
    call: async ({ target }) => (await monthActions()).saveMonthForm(target.siteId, "2026-03", { expectedVersion: 0, readings: [] }),
  },
  {
    id: "app/(app)/sites/[siteId]/months/[month]/actions.ts#loadSavedMonth",
    allowed: ["administrator", "process_engineer", "environmental_officer", "signatory", "auditor"],
    call: async ({ target }) => (await monthActions()).loadSavedMonth(target.siteId, "2026-03"),
  },
];
