/** The benches' private database: started if it is not running, and stopped at the end only if this run started it. */
import { execFileSync } from "node:child_process";
import path from "node:path";

const root = path.resolve(import.meta.dirname, "../..");
const db = (command: string) => execFileSync("bash", ["server/scripts/db.sh", command], { cwd: root, stdio: "ignore" });

export function openBenchDatabase(): { stop: () => void } {
  let wasRunning = true;
  try {
    db("status");
  } catch {
    wasRunning = false;
    db("start");
  }
  return { stop: () => (wasRunning ? undefined : db("stop")) };
}
