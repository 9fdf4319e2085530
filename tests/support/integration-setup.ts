import { vi } from "vitest";

// Server actions read the client's address through next/headers, which needs a Next request.
vi.mock("next/headers", () => import("./next-headers"));
