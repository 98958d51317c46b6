import { describe, expect, it } from "vitest";
import { loadConfig } from "../../server/config.ts";

describe("configuration parsed once at boot", () => {
  it("when several keys are bad, then the error lists every one of them", () => {
    let message = "";
    try {
      loadConfig({ PORT: "eighty", DB_PORT: "0", LOG_LEVEL: "loud", APP_URL: "not a url" });
    } catch (err) {
      message = (err as Error).message;
    }
    for (const key of ["PORT", "DB_PORT", "LOG_LEVEL", "APP_URL"]) expect(message).toMatch(new RegExp(`^  ${key}: `, "m"));
  });

  it("when production runs with the development secret, then boot is refused", () => {
    expect(() => loadConfig({ NODE_ENV: "production" })).toThrow(/JWT_SECRET: set a secret of your own/);
  });

  it("when nothing is set, then bcrypt cost is 12 in production and lower elsewhere (OWASP Password Storage cheat sheet: cost >= 10)", () => {
    expect(loadConfig({ NODE_ENV: "production", JWT_SECRET: "x".repeat(40) }).BCRYPT_COST).toBe(12);
    expect(loadConfig({ NODE_ENV: "development" }).BCRYPT_COST).toBe(10);
  });
});
