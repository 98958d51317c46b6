/**
 * Memory: every answer is already bounded by paging, windows and caps; this guards the rest, so
 * the heaviest user gets a clear error and the process lives on. A request that arrives while the
 * heap is nearly full is refused with 503 and Retry-After (the collector catches up meanwhile), and
 * a JSON answer over the answer budget is refused with a clear 500 before it is written: its size
 * means a bound is missing, so it is logged as an error.
 */
import type { RequestHandler } from "express";
import { getHeapStatistics } from "node:v8";
import { sendProblem } from "./problem.ts";

export interface MemoryBudget {
  /** The share of the heap limit above which new requests are turned away, 0–1. */
  heapFraction: number;
  /** The largest JSON answer, in bytes. */
  answerBytes: number;
}

const sizeText = (bytes: number) => (bytes >= 2 ** 20 ? `${Math.round(bytes / 2 ** 20)} MB` : `${Math.round(bytes / 1024)} KB`);

export function memoryBudget({ heapFraction, answerBytes }: MemoryBudget): RequestHandler {
  return (req, res, next) => {
    const heap = getHeapStatistics();
    if (heap.used_heap_size > heapFraction * heap.heap_size_limit) {
      req.log?.warn({ used: heap.used_heap_size, limit: heap.heap_size_limit }, "request refused: heap nearly full");
      sendProblem(req, res, {
        status: 503,
        title: "Server busy",
        detail: "The server is short of memory for a moment; try again shortly.",
        retryAfterSeconds: 30,
      });
      return;
    }
    // Serialised once, here, so the size is known before anything is sent.
    res.json = (body: unknown) => {
      const text = JSON.stringify(body) ?? "null";
      if (text.length > answerBytes / 3 && Buffer.byteLength(text, "utf8") > answerBytes) {
        req.log?.error({ bytes: Buffer.byteLength(text, "utf8"), answerBytes }, "answer over its memory budget");
        return sendProblem(req, res, {
          status: 500,
          title: "Answer too large",
          detail: `This answer would be larger than the ${sizeText(answerBytes)} the server sends at once. Narrow it (a shorter period, fewer lots, one page at a time).`,
        });
      }
      if (!res.get("Content-Type")) res.type("application/json");
      return res.send(text);
    };
    next();
  };
}
