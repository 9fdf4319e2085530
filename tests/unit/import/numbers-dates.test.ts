import { describe, expect, it } from "vitest";
import { parseDate } from "@/lib/import/dates";
import { parseNumber } from "@/lib/import/numbers";

const plain = { decimal: ".", thousands: "none" } as const;

describe("parseNumber", () => {
  it("keeps the text exactly, never through a float", () => {
    expect(parseNumber("0.1", plain)).toEqual({ ok: true, value: "0.1" });
    expect(parseNumber(" 26000000.123456789012345 ", plain)).toEqual({ ok: true, value: "26000000.123456789012345" });
    expect(parseNumber("+7", plain)).toEqual({ ok: true, value: "7" });
  });
  it("refuses a thousands separator the mapping does not declare, and says how to declare it", () => {
    const r = parseNumber("1,234.5", plain, "quantity");
    expect(r).toEqual({ ok: false, reason: expect.stringMatching(/^"1,234.5" contains a comma .* set it as the thousands separator in the column mapping/) });
  });
  it("reads declared separators", () => {
    expect(parseNumber("1,234.5", { decimal: ".", thousands: "," })).toEqual({ ok: true, value: "1234.5" });
    expect(parseNumber("1.234.567,25", { decimal: ",", thousands: "." })).toEqual({ ok: true, value: "1234567.25" });
    expect(parseNumber("1\u202f234", { decimal: ".", thousands: " " })).toEqual({ ok: true, value: "1234" });
    expect(parseNumber("12,34,567", { decimal: ".", thousands: "," }).ok).toBe(false);
  });
  it("refuses negatives, text and exponents with the reason", () => {
    expect(parseNumber("-12.5", plain, "quantity")).toEqual({ ok: false, reason: '"-12.5" is negative; a quantity cannot be below zero' });
    expect(parseNumber("(12)", plain, "quantity").ok).toBe(false);
    expect(parseNumber("n/a", plain)).toEqual({ ok: false, reason: '"n/a" is not a number' });
    expect(parseNumber("1e5", plain)).toEqual({ ok: false, reason: '"1e5" is in exponent notation; write the number out in full' });
    expect(parseNumber("", plain, "quantity")).toEqual({ ok: false, reason: "the quantity is empty" });
  });
});

describe("parseDate", () => {
  it("reads each declared format and no other", () => {
    expect(parseDate("2026-03-04", "YYYY-MM-DD")).toEqual({ ok: true, day: "2026-03-04", month: "2026-03" });
    expect(parseDate("2026-03-04T00:00", "YYYY-MM-DD")).toEqual({ ok: true, day: "2026-03-04", month: "2026-03" });
    expect(parseDate("03/04/2026", "DD/MM/YYYY")).toEqual({ ok: true, day: "2026-04-03", month: "2026-04" });
    expect(parseDate("03/04/2026", "MM/DD/YYYY")).toEqual({ ok: true, day: "2026-03-04", month: "2026-03" });
    expect(parseDate("4.3.2026", "DD.MM.YYYY")).toEqual({ ok: true, day: "2026-03-04", month: "2026-03" });
    expect(parseDate("2026-03", "YYYY-MM")).toEqual({ ok: true, day: null, month: "2026-03" });
    expect(parseDate("2026-03-04", "DD/MM/YYYY")).toEqual({ ok: false, reason: '"2026-03-04" is not a date in DD/MM/YYYY' });
  });
  it("refuses days that do not exist", () => {
    expect(parseDate("30/02/2026", "DD/MM/YYYY")).toEqual({ ok: false, reason: '"30/02/2026": 2026-02 has no day 30 (read as DD/MM/YYYY)' });
    expect(parseDate("29/02/2028", "DD/MM/YYYY").ok).toBe(true);
    expect(parseDate("13/13/2026", "DD/MM/YYYY")).toEqual({ ok: false, reason: '"13/13/2026" has no month 13 (read as DD/MM/YYYY)' });
  });
});
