/** For z.preprocess: an empty or blank text (a query parameter or a setting left empty) counts as not given. */
export const blankIsAbsent = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);
