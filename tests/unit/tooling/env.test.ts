/** lib/env.ts: the settings the app reads from the environment, checked once per change. */
import { afterEach, describe, expect, it, vi } from "vitest";
import { appUrl, env, EnvError, requireServerEnv } from "@/lib/env";

afterEach(() => vi.unstubAllEnvs());

describe("env()", () => {
  it("gives the documented defaults and treats an empty value as unset", () => {
    vi.stubEnv("DB_POOL_MAX", "");
    vi.stubEnv("MAIL_FROM", " ");
    vi.stubEnv("PORT", "");
    vi.stubEnv("HOST", "");
    const e = env();
    expect(e.DB_POOL_MAX).toBe(10);
    expect(e.MAIL_FROM).toBe("Synledger <no-reply@synledger.invalid>");
    expect(e.PORT).toBe(3000);
    expect(e.HOST).toBe("0.0.0.0");
  });

  it("reads a changed value at once (parsed again only when a value changed)", () => {
    vi.stubEnv("DB_POOL_MAX", "7");
    expect(env().DB_POOL_MAX).toBe(7);
    expect(env()).toBe(env());
    vi.stubEnv("DB_POOL_MAX", "12");
    expect(env().DB_POOL_MAX).toBe(12);
  });

  it("names every bad setting in one error", () => {
    vi.stubEnv("DB_POOL_MAX", "ten");
    vi.stubEnv("APP_URL", "not a url");
    vi.stubEnv("MAIL_WORKER", "yes");
    vi.stubEnv("AUTH_SECRET", "short");
    expect(() => env()).toThrow(EnvError);
    const message = (() => {
      try {
        env();
        return "";
      } catch (e) {
        return (e as Error).message;
      }
    })();
    for (const part of ["DB_POOL_MAX must be a whole number", "APP_URL must be a URL", "AUTH_SECRET must be at least 32 characters", "MAIL_WORKER must be 0 or 1"]) expect(message).toContain(part);
  });

  it("appUrl: APP_URL, else AUTH_URL, else the local default, without a trailing slash", () => {
    vi.stubEnv("APP_URL", "https://ledger.example.test/");
    expect(appUrl()).toBe("https://ledger.example.test");
    vi.stubEnv("APP_URL", "");
    vi.stubEnv("AUTH_URL", "https://auth.example.test//");
    expect(appUrl()).toBe("https://auth.example.test");
    vi.stubEnv("AUTH_URL", "");
    expect(appUrl()).toBe("http://localhost:3000");
  });
});

describe("requireServerEnv()", () => {
  it("names what a serving instance cannot start without", () => {
    vi.stubEnv("DATABASE_URL", "");
    vi.stubEnv("AUTH_SECRET", "");
    expect(() => requireServerEnv()).toThrow("Settings missing from the environment: DATABASE_URL, AUTH_SECRET");
    vi.stubEnv("DATABASE_URL", "postgres://app@127.0.0.1:5432/x");
    vi.stubEnv("AUTH_SECRET", "s".repeat(32));
    expect(requireServerEnv().DATABASE_URL).toBe("postgres://app@127.0.0.1:5432/x");
  });
});
