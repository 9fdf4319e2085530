import { z } from "zod";
import { COMPONENTS } from "@/lib/balance/components";
import { UNITS } from "@/lib/balance/units";
import { DATE_FORMATS } from "./dates";
import { DECIMAL_SEPARATORS, THOUSANDS_SEPARATORS } from "./numbers";

/**
 * How the columns of a CSV file map onto Synledger's figures. Three layouts:
 *  - "long": one row per date and stream (date, stream or meter tag, quantity, optional unit);
 *  - "wide": one row per date, one column per stream;
 *  - "analyses": one row per lab sample (date, analysis or stream, one column per component, mol %).
 * The same schema checks the wizard's form, the preview and commit handlers, and the saved mapping.
 */
export const DELIMITERS = ["auto", ",", ";", "\t", "|"] as const;
export type Delimiter = (typeof DELIMITERS)[number];

const column = z.string().trim().min(1, "choose a column").max(200, "column name is longer than 200 characters");

const common = {
  name: z.string().trim().min(1, "give the mapping a name").max(80, "the name is longer than 80 characters"),
  delimiter: z.enum(DELIMITERS).default("auto"),
  dateColumn: column,
  dateFormat: z.enum(DATE_FORMATS, { error: `date format must be one of ${DATE_FORMATS.join(", ")}` }),
  decimalSeparator: z.enum(DECIMAL_SEPARATORS).default("."),
  thousandsSeparator: z.enum(THOUSANDS_SEPARATORS).default("none"),
};

export const longMappingSchema = z.strictObject({
  ...common,
  layout: z.literal("long"),
  streamColumn: column,
  quantityColumn: column,
  /** Without a unit column every value is in the stream's own unit. */
  unitColumn: column.optional(),
});

export const wideMappingSchema = z.strictObject({
  ...common,
  layout: z.literal("wide"),
  columns: z
    .array(
      z.strictObject({
        column,
        stream: z.string().trim().min(1, "choose a stream"),
        unit: z.enum(UNITS).optional(),
      }),
    )
    .min(1, "map at least one column to a stream")
    .max(500),
});

export const analysesMappingSchema = z.strictObject({
  ...common,
  layout: z.literal("analyses"),
  /** Holds the analysis name (e.g. "estuary-grid-gas") or the key of a stream that uses it. */
  analysisColumn: column,
  components: z
    .array(z.strictObject({ column, component: z.enum(COMPONENTS, { error: `component must be one of ${COMPONENTS.join(", ")}` }) }))
    .min(1, "map at least one component column")
    .max(COMPONENTS.length),
});

export const importMappingSchema = z
  .discriminatedUnion("layout", [longMappingSchema, wideMappingSchema, analysesMappingSchema])
  .superRefine((m, ctx) => {
    if (m.thousandsSeparator === m.decimalSeparator) {
      ctx.addIssue({ code: "custom", path: ["thousandsSeparator"], message: "the thousands separator must differ from the decimal separator" });
    }
    const used = m.layout === "wide" ? m.columns.map((c) => c.column) : m.layout === "analyses" ? m.components.map((c) => c.column) : [];
    const seen = new Set<string>();
    used.forEach((c, i) => {
      if (seen.has(c)) ctx.addIssue({ code: "custom", path: [m.layout === "wide" ? "columns" : "components", i, "column"], message: `column "${c}" is mapped twice` });
      seen.add(c);
    });
    if (m.layout === "analyses") {
      const comps = new Set<string>();
      m.components.forEach((c, i) => {
        if (comps.has(c.component)) ctx.addIssue({ code: "custom", path: ["components", i, "component"], message: `${c.component} is mapped from two columns` });
        comps.add(c.component);
      });
    }
  });

export type ImportMapping = z.output<typeof importMappingSchema>;
export type ImportMappingInput = z.input<typeof importMappingSchema>;
export type ImportLayout = ImportMapping["layout"];

export const LAYOUT_LABELS: Record<ImportLayout, string> = {
  long: "One row per date and stream",
  wide: "One row per date, one column per stream",
  analyses: "Lab analyses, one column per component",
};
