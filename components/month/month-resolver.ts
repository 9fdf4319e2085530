import { toNestErrors } from "@hookform/resolvers";
import type { FieldError, Resolver } from "react-hook-form";
import { zodIssues } from "@/lib/auth/errors";
import { monthFiguresSchema } from "@/lib/validations/month";
import { SUM_TOLERANCE_TEXT, analysisSum, formPath, toFigures, type MonthFormValues } from "./month-values";

/**
 * Checks the form with monthFiguresSchema itself (the schema the API and import use) on the
 * payload the form would send, then puts each message back on the field it names. The analysis
 * sum rule is checked here too, so a refused composition is caught before the round trip.
 */
export const monthResolver: Resolver<MonthFormValues> = async (values, _context, options) => {
  const { figures, map } = toFigures(values, 0);
  const flat: Record<string, FieldError> = {};
  const put = (path: string | null, message: string) => {
    if (path && !flat[path]) flat[path] = { type: "validate", message };
  };
  const parsed = monthFiguresSchema.safeParse(figures);
  if (!parsed.success) for (const i of zodIssues(parsed.error.issues)) put(formPath(i.path, map, values), i.message);
  values.analyses.forEach((a, i) => {
    const s = analysisSum(a);
    if (s.status === "refused")
      put(`analyses.${i}.total`, `The components sum to ${s.total.toFixed()} mol %, more than ${SUM_TOLERANCE_TEXT} from 100: check the figures.`);
    if (s.status === "empty" && a.saved) put(`analyses.${i}.total`, "A saved analysis cannot be emptied here; correct its figures instead.");
  });
  if (Object.keys(flat).length === 0) return { values, errors: {} };
  return { values: {}, errors: toNestErrors(flat, options) };
};
