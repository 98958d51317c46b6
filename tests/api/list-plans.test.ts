/**
 * The paged lists' SQL, read back with EXPLAIN (MariaDB KB, "EXPLAIN"): each list's page query has
 * an index that delivers its order, so MariaDB can read a page in index order and stop, instead of
 * sorting every matching row ("Using filesort"). The test data is small, so the optimizer may still
 * prefer a scan here; the index is forced to show it serves the order, and the bench shows that
 * MariaDB picks it by itself at 100,000 lots.
 */
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { buildTestApp, DEMO, ORG, signInAs, type SignedInAgent, type TestApp } from "../support/api.ts";

let t: TestApp;
let tech: SignedInAgent;
beforeAll(async () => {
  t = buildTestApp();
  tech = await signInAs(t.app, DEMO.buyerTechnologist);
});
afterAll(() => t.close());

/** The statements one request runs, in order. */
async function statementsOf(path: string): Promise<string[]> {
  const statements: string[] = [];
  // Sequelize reads options.logging on every query; the typings leave `options` out.
  const options = (t.sequelize as unknown as { options: { logging: false | ((sql: string) => void) } }).options;
  options.logging = (sql) => statements.push(sql.replace(/^Executing \([^)]*\): /, ""));
  try {
    expect((await tech.agent.get(path)).status).toBe(200);
  } finally {
    options.logging = false;
  }
  return statements;
}

interface PlanRow {
  table: string;
  possible_keys: string | null;
  key: string | null;
  Extra: string | null;
}

const explain = (sql: string) => t.sequelize.query<PlanRow>(`EXPLAIN ${sql}`, { type: QueryTypes.SELECT });

describe("index plans of the paged lists", () => {
  for (const [list, path, table, index] of [
    ["lots", "/lots?limit=20", "lots", "lots_newest"],
    ["lots of one contract", "/lots?limit=20&contract=CONTRACT", "lots", "lots_contract_newest"],
    ["readiness", "/readiness?limit=20", "lots", "lots_due"],
  ] as const) {
    it(`when the ${list} page is read, then its query may use ${index}`, async () => {
      const contract = (await tech.agent.get(`/api/orgs/${ORG.retailer}/contracts`)).body[0].id as number;
      const sql = await statementsOf(`/api/orgs/${ORG.retailer}${path.replace("CONTRACT", String(contract))}`);
      const page = sql.find((s) => s.includes(`FROM \`${table}\``) && s.includes("ORDER BY") && s.includes("LIMIT"));
      expect(page, sql.join("\n")).toBeDefined();
      const alias = "Lot";
      const forced = page!.replace(
        `FROM \`${table}\` AS \`${alias}\``,
        `FROM \`${table}\` AS \`${alias}\` FORCE INDEX FOR ORDER BY (\`${index}\`)`,
      );
      expect(forced).not.toBe(page);
      const row = (await explain(forced)).find((r) => r.table === alias)!;
      // An index that delivers the order: read in index order, no sort of the matching rows.
      expect(row.key, forced).toMatch(new RegExp(`^${index}$`));
      expect(row.Extra ?? "", JSON.stringify(row)).not.toContain("filesort");
    });
  }
});
