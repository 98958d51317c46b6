/**
 * The contracts an organisation is party to (and any others named, such as a laboratory's audited
 * ones), with their wine and both parties, as plain rows from one hand-written statement. Every list
 * starts here, so it costs one query and no ORM include tree.
 */
import { QueryTypes } from "sequelize";
import { database } from "../../db/database.ts";
import { jsonColumn } from "../../db/json-column.ts";
import type { ContractWithParties } from "./spec-access.ts";

const party = (prefix: string) =>
  `${prefix}.id AS ${prefix}_id, ${prefix}.name AS ${prefix}_name, ${prefix}.kind AS ${prefix}_kind, ${prefix}.country AS ${prefix}_country,
   ${prefix}.created_at AS ${prefix}_created_at, ${prefix}.updated_at AS ${prefix}_updated_at`;

const SELECT = `
  SELECT c.id, c.reference, c.retailer_org_id, c.producer_org_id, c.wine_id, c.starts_on, c.ends_on, c.created_at, c.updated_at,
         c.producer_accepted_at, c.producer_accepted_by,
         w.name AS w_name, w.colour AS w_colour, w.category AS w_category, w.region AS w_region, w.markets AS w_markets,
         w.nominal_sugar_g_per_l AS w_sugar, w.nominal_alcohol_percent_vol AS w_alcohol, w.law_facts AS w_law_facts,
         w.created_at AS w_created_at, w.updated_at AS w_updated_at,
         ${party("r")}, ${party("p")}
    FROM contracts c
    JOIN wines w ON w.id = c.wine_id
    JOIN organisations r ON r.id = c.retailer_org_id
    JOIN organisations p ON p.id = c.producer_org_id`;

type Row = Record<string, unknown>;

const organisationOf = (row: Row, prefix: string) => ({
  id: row[`${prefix}_id`],
  name: row[`${prefix}_name`],
  kind: row[`${prefix}_kind`],
  country: row[`${prefix}_country`],
  createdAt: row[`${prefix}_created_at`],
  updatedAt: row[`${prefix}_updated_at`],
});

function contractOf(row: Row): ContractWithParties {
  return {
    id: row.id,
    reference: row.reference,
    retailerOrgId: row.retailer_org_id,
    producerOrgId: row.producer_org_id,
    wineId: row.wine_id,
    startsOn: row.starts_on,
    endsOn: row.ends_on,
    producerAcceptedAt: row.producer_accepted_at,
    producerAcceptedBy: row.producer_accepted_by,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    wine: {
      id: row.wine_id,
      retailerOrgId: row.retailer_org_id,
      producerOrgId: row.producer_org_id,
      name: row.w_name,
      colour: row.w_colour,
      category: row.w_category,
      region: row.w_region,
      markets: jsonColumn(row.w_markets as string),
      nominalSugarGPerL: row.w_sugar,
      nominalAlcoholPercentVol: row.w_alcohol,
      lawFacts: row.w_law_facts === null ? null : jsonColumn(row.w_law_facts as string),
      createdAt: row.w_created_at,
      updatedAt: row.w_updated_at,
    },
    retailer: organisationOf(row, "r"),
    producer: organisationOf(row, "p"),
  } as unknown as ContractWithParties;
}

/** Ordered by reference, as every list of contracts shows them. */
export async function partyContracts(orgId: number, alsoIds: readonly number[] = []): Promise<ContractWithParties[]> {
  const rows = await database().query<Row>(
    `${SELECT} WHERE c.retailer_org_id = :orgId OR c.producer_org_id = :orgId${alsoIds.length ? " OR c.id IN (:alsoIds)" : ""} ORDER BY c.reference, c.id`,
    { replacements: { orgId, alsoIds }, type: QueryTypes.SELECT },
  );
  return rows.map(contractOf);
}
