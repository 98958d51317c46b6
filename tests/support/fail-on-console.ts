/**
 * A console error or warning during a test fails that test: a test passes only if nothing it ran
 * complained. (Browser pages are watched separately, by the stack in stack.ts.)
 */
import { afterEach, beforeEach, vi } from "vitest";

let complaints: string[] = [];

beforeEach(() => {
  complaints = [];
  for (const level of ["error", "warn"] as const) {
    vi.spyOn(console, level).mockImplementation((...args: unknown[]) => {
      complaints.push(`console.${level}: ${args.map((a) => (a instanceof Error ? a.stack : String(a))).join(" ")}`);
    });
  }
});

afterEach(() => {
  vi.restoreAllMocks();
  if (complaints.length) throw new Error(`The test wrote to the console:\n${complaints.join("\n")}`);
});
