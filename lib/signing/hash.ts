import { createHash } from "node:crypto";

/** Lower-case hex SHA-256: the identity of a stored statement and of a certificate. */
export function sha256Hex(data: Buffer | Uint8Array | string): string {
  return createHash("sha256").update(data).digest("hex");
}
