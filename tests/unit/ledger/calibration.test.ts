/** Calibration due dates: calendar arithmetic, common practice, no source (the interval is the site's own rule). */
import { describe, expect, it } from "vitest";
import { calibrationDueOn, overdueMeters } from "@/lib/ledger/calibration";

describe("calibration due dates", () => {
  it("adds whole months, clamping to the month's last day", () => {
    expect(calibrationDueOn("2025-01-30", 12)).toBe("2026-01-30");
    expect(calibrationDueOn("2025-08-31", 6)).toBe("2026-02-28");
    expect(calibrationDueOn("2024-02-29", 12)).toBe("2025-02-28");
  });

  it("names the meters due before a day, and only those with an interval", () => {
    const meters = [
      { key: "feed", name: "Feed", meterTag: "FT-1", calibratedOn: "2025-01-30", calibrationIntervalMonths: 12 },
      { key: "fuel", name: "Fuel", meterTag: "FT-2", calibratedOn: "2025-10-14", calibrationIntervalMonths: 12 },
      { key: "air", name: "Air", meterTag: "FT-3", calibratedOn: "2020-01-01", calibrationIntervalMonths: null },
    ];
    expect(overdueMeters(meters, "2026-03-31").map((o) => [o.meter.key, o.dueOn])).toEqual([["feed", "2026-01-30"]]);
    expect(overdueMeters(meters, "2026-01-30")).toEqual([]);
  });
});
