import { HttpError } from "@/lib/auth/errors";
import { readBodyText } from "@/lib/api/body";
import { v1Route } from "@/lib/api/route";
import { calculate, CalculationInputError } from "@/lib/balance/calculate";
import { toResultDocument } from "@/lib/balance/result";
import { parsePlantMonthText } from "@/lib/balance/schema";

/**
 * POST /api/v1/calculate: a plant-month file in, the result document out; nothing is stored.
 * The body is read as text so JSON numbers keep their literal digits (never a binary double).
 */
export const POST = v1Route({ permission: "org:read", what: "run calculations" }, async (req) => {
  const parsed = parsePlantMonthText(await readBodyText(req));
  if (!parsed.ok) {
    throw new HttpError(400, "invalid_plant_month", "The body is not a valid plant-month document.", parsed.issues.map((i) => ({ path: i.path, message: i.reason })));
  }
  try {
    return Response.json(toResultDocument(calculate(parsed.doc)));
  } catch (err) {
    if (err instanceof CalculationInputError) {
      throw new HttpError(400, "invalid_plant_month", "The document is well formed but cannot be calculated.", [{ path: err.path, message: err.reason }]);
    }
    throw err;
  }
});
