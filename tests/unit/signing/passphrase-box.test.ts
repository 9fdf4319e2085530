import { describe, expect, it } from "vitest";
import { openPassphrase, sealPassphrase } from "@/lib/signing/passphrase-box";

const SECRET = "s".repeat(40);
const FP = "c".repeat(64);

describe("sealed certificate passphrases", () => {
  it("open again with the same secret and fingerprint", () => {
    const sealed = sealPassphrase("Kestrel-7 passphrase", FP, SECRET);
    expect(sealed).not.toContain("Kestrel");
    expect(sealed.startsWith("v1.")).toBe(true);
    expect(openPassphrase(sealed, FP, SECRET)).toBe("Kestrel-7 passphrase");
  });
  it("differ each time (random IV)", () => {
    expect(sealPassphrase("p", FP, SECRET)).not.toBe(sealPassphrase("p", FP, SECRET));
  });
  it("refuse to open under another secret, another certificate, or after tampering", () => {
    const sealed = sealPassphrase("p", FP, SECRET);
    expect(() => openPassphrase(sealed, FP, "t".repeat(40))).toThrow();
    expect(() => openPassphrase(sealed, "d".repeat(64), SECRET)).toThrow();
    const parts = sealed.split(".");
    parts[3] = Buffer.from("x").toString("base64url");
    expect(() => openPassphrase(parts.join("."), FP, SECRET)).toThrow();
  });
  it("refuse a short secret", () => {
    expect(() => sealPassphrase("p", FP, "short")).toThrow(/at least 32/);
  });
});
