/** npm run bench: each benchmark prints its own ratio, measured side by side in this process. */
await import("./engine.bench.ts");
await import("./import.bench.ts");
await import("./mail.bench.ts");
await import("./routes.bench.ts");
export {};
