/** npm run seed:scale -- --lots 100000: grows the demo database (DB_NAME) to a national retailer's size; see server/db/grow-demo.ts. */
import { parseArgs } from "node:util";
import { loadConfig } from "../config.ts";
import { createSequelize } from "../db/connection.ts";
import { demoSize, growDemo } from "../db/grow-demo.ts";

const { values } = parseArgs({ options: { lots: { type: "string", default: "100000" }, chunk: { type: "string", default: "10000" } } });
const total = Number(values.lots);
if (!Number.isInteger(total) || total < 1 || total > 5_000_000) throw new Error("--lots takes a whole number from 1 to 5,000,000");

const config = loadConfig(process.env);
const sequelize = createSequelize(config);
const started = performance.now();
await growDemo(sequelize, total, Number(values.chunk), (done) =>
  process.stdout.write(`\r${done.toLocaleString("en-GB")} of ${total.toLocaleString("en-GB")} lots`),
);
const size = await demoSize(sequelize);
console.log(
  `\nThe database ${config.DB_NAME} now holds ${Object.entries(size)
    .map(([name, n]) => `${n.toLocaleString("en-GB")} ${name}`)
    .join(", ")} (${((performance.now() - started) / 1000).toFixed(0)} s).`,
);
await sequelize.close();
