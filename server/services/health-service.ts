import { database } from "../db/database.ts";

export async function databaseHealth(): Promise<{ status: "up" | "down"; latencyMs: number; error?: string }> {
  const started = performance.now();
  try {
    await database().authenticate();
    return { status: "up", latencyMs: Math.round(performance.now() - started) };
  } catch (err) {
    return { status: "down", latencyMs: Math.round(performance.now() - started), error: (err as Error).message };
  }
}
