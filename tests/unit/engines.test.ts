/**
 * The Node.js version the project declares (package.json "engines", npm docs "engines") is one
 * every direct dependency declares it runs on, so a newcomer with that version can install and run all of it.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import semver from "semver";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../..");
const own = JSON.parse(readFileSync(path.join(root, "package.json"), "utf8"));

describe("the declared Node.js version", () => {
  it("when each direct dependency's engines.node is read, then the project's lowest supported version satisfies it", () => {
    const lowest = semver.minVersion(own.engines.node)!.version;
    const refused: string[] = [];
    for (const name of Object.keys({ ...own.dependencies, ...own.devDependencies })) {
      const manifest = JSON.parse(readFileSync(path.join(root, "node_modules", name, "package.json"), "utf8"));
      const wanted = manifest.engines?.node;
      if (wanted && !semver.satisfies(lowest, wanted)) refused.push(`${name} wants node ${wanted}`);
    }
    expect(refused).toEqual([]);
    // The machine running the tests is a supported one too.
    expect(semver.satisfies(process.versions.node, own.engines.node)).toBe(true);
  });
});
