// org:create's input and slug (issue 19): the names people type become URL-safe slugs; bad input names its field.
import { describe, expect, it } from "vitest";
import { createOrganisationInput, slugOf } from "@/lib/onboarding/create-organisation";

describe("org:create input", () => {
  it("slugs keep letters and digits, fold accents, and end with the random tail", () => {
    expect(slugOf("Tarnbeck Ämmonia Co.", "ab12cd")).toBe("tarnbeck-ammonia-co-ab12cd");
    expect(slugOf("  ---  ", "zz")).toBe("org-zz");
  });
  it("refuses a one-letter name and an address without a domain, naming each field", () => {
    const r = createOrganisationInput.safeParse({ name: "X", adminEmail: "nobody" });
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => i.path.join(".")).sort()).toEqual(["adminEmail", "name"]);
  });
  it("stores the administrator's address in lower case", () => {
    expect(createOrganisationInput.parse({ name: "Tarnbeck", adminEmail: "Ines@Tarnbeck.Example" }).adminEmail).toBe("ines@tarnbeck.example");
  });
});
