/**
 * Stand-in for `next/headers` in integration tests, where server actions run outside a Next
 * request: `headers()` answers with what the test set through `setRequestHeaders()` (by default
 * a request from the documentation address 192.0.2.1 as the app server would mark it).
 */
import { CLIENT_ADDRESS_HEADER } from "@/lib/net/forwarded";

const DEFAULT = { [CLIENT_ADDRESS_HEADER]: "192.0.2.1", "user-agent": "vitest" };
let current: Record<string, string> = DEFAULT;

export function setRequestHeaders(h: Record<string, string> | null): void {
  current = h ?? DEFAULT;
}

export async function headers(): Promise<Headers> {
  return new Headers(current);
}

export async function cookies(): Promise<{ get: () => undefined }> {
  return { get: () => undefined };
}
