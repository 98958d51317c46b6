/**
 * The demo organisations and contracts the API and browser tests use, found by name and reference
 * before each test file runs (never by their ids, which belong to the seeders). Tests read them
 * from `ORG` and `CONTRACT` (tests/support/api.ts).
 */
import { beforeAll } from "vitest";
import { QueryTypes } from "sequelize";
import { loadConfig } from "../../server/config.ts";
import { createSequelize } from "../../server/db/connection.ts";
import { CONTRACT, CONTRACT_REFERENCES, ORG, ORGANISATION_NAMES } from "./api.ts";

beforeAll(async () => {
  const sequelize = createSequelize(loadConfig(process.env));
  try {
    const orgs = await sequelize.query<{ id: number; name: string }>("SELECT id, name FROM organisations WHERE name IN (:names)", {
      replacements: { names: Object.values(ORGANISATION_NAMES) },
      type: QueryTypes.SELECT,
    });
    const contracts = await sequelize.query<{ id: number; reference: string }>(
      "SELECT id, reference FROM contracts WHERE reference IN (:refs)",
      {
        replacements: { refs: Object.values(CONTRACT_REFERENCES) },
        type: QueryTypes.SELECT,
      },
    );
    for (const [key, name] of Object.entries(ORGANISATION_NAMES)) ORG[key as keyof typeof ORG] = orgs.find((o) => o.name === name)!.id;
    for (const [key, ref] of Object.entries(CONTRACT_REFERENCES))
      CONTRACT[key as keyof typeof CONTRACT] = contracts.find((c) => c.reference === ref)!.id;
  } finally {
    await sequelize.close();
  }
});
