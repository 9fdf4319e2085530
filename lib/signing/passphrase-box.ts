import "server-only";

/** The app's entry to passphrase sealing; the implementation lives in passphrase-crypto.ts. */
export { openPassphrase, sealPassphrase } from "./passphrase-crypto";
