import { vi } from "vitest";

// Server actions read the client's address through next/headers, which needs a Next request.
vi.mock("next/headers", () => import("./next-headers"));
// The guard's session reader answers with the session a test chose through actAs().
vi.mock("@/lib/auth/session-token", () => import("./mock-auth"));
