import type { ImportSite } from "@/lib/import/types";

/** A small site like the demo's Estuary Works: stream keys, meter tags and units. */
export const SITE: ImportSite = {
  name: "Test Works",
  streams: [
    { key: "feed", name: "Feed gas", kind: "feed-gas", unit: "Sm3", meterTag: "TW-FQ-101", analysisKey: "grid-gas", archived: false },
    { key: "fuel", name: "Fuel gas", kind: "fuel-gas", unit: "Sm3", meterTag: "TW-FQ-102", analysisKey: "grid-gas", archived: false },
    { key: "nh3", name: "Ammonia", kind: "ammonia", unit: "t", meterTag: "TW-WQ-501", analysisKey: null, archived: false },
    { key: "old", name: "Old meter", kind: "co2-vent", unit: "t", meterTag: "TW-OLD", analysisKey: null, archived: true },
  ],
};
