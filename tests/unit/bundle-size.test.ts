import { describe, expect, it } from "vitest";
import { existsSync, readFileSync } from "node:fs";
import { gzipSync } from "node:zlib";
import path from "node:path";

const dist = path.resolve(import.meta.dirname, "../../dist");
const gz = (file: string) => gzipSync(readFileSync(path.join(dist, file)), { level: 9 }).length;

describe("client bundle budget (Alex Russell's 130-170 KB critical-path JS budget)", () => {
  it("when the built page loads, then its entry script and every chunk it preloads stay within 170 KB gzip", () => {
    expect(existsSync(path.join(dist, "index.html")), "run `npx vite build` first").toBe(true);
    const html = readFileSync(path.join(dist, "index.html"), "utf8");
    const initial = [...html.matchAll(/(?:src|href)="\/(assets\/[^"]+\.js)"/g)].map((m) => m[1]!);
    expect(initial.length).toBeGreaterThan(0);
    const total = initial.reduce((sum, f) => sum + gz(f), 0);
    expect(total).toBeLessThanOrEqual(170 * 1024);
  });
});
