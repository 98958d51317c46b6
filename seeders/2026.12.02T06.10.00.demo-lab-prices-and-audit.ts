/**
 * Northgate Oenology Laboratory's price list (invented prices, in cents), and one audit order that
 * Harbourline's finance staff placed but have not paid yet, so the finance page has something to show.
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";
import { Lot } from "../server/models/lot.ts";
import type { ParameterId } from "../shared/engine/index.ts";
import { useDemoServices } from "./support/demo-services.ts";
import { auditOrder, party, priced } from "../tests/support/factories.ts";

const LAB = 5;
const NOTE = "Spot check before the flexitank leaves.";
const PRICES: [ParameterId, number][] = [
  ["alcohol", 1800],
  ["free_so2", 1400],
  ["total_so2", 1400],
  ["volatile_acidity", 1600],
  ["total_acidity", 1200],
  ["ph", 800],
  ["residual_sugar", 2200],
  ["malic_acid", 2400],
  ["lactic_acid", 2400],
  ["citric_acid", 2400],
  ["sorbic_acid", 3500],
  ["density", 900],
  ["total_dry_extract", 1500],
  ["heat_test_haze", 2800],
  ["cold_stability_conductivity", 3200],
  ["turbidity", 900],
  ["iron", 2600],
  ["copper", 2600],
  ["lead", 5500],
  ["dissolved_oxygen", 1500],
  ["carbon_dioxide", 1700],
  ["yeast_count", 3800],
  ["bacteria_count", 3800],
  ["tca", 9500],
  ["ethylphenol_4", 7800],
  ["ethylguaiacol_4", 7800],
  ["methanol", 4200],
  ["ochratoxin_a", 8800],
];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  useDemoServices(qi);
  await priced(await party("nadia.brook@northgate-lab.test", "org_admin"), PRICES);
  const lot = await Lot.findOne({
    where: { contractId: 3 },
    order: [
      ["vintage", "DESC"],
      ["id", "DESC"],
    ],
  });
  if (!lot) return;
  await auditOrder(await party("owen.pryce@harbourline.test", "buyer_finance"), {
    contractId: 3,
    laboratoryOrgId: LAB,
    lotIds: [lot.id],
    parameters: ["volatile_acidity", "free_so2", "dissolved_oxygen"],
    stage: "pre_shipment",
    note: NOTE,
  });
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("DELETE FROM audit_orders WHERE buyer_org_id = 1 AND note = 'Spot check before the flexitank leaves.'");
  await qi.bulkDelete("lab_prices", { organisation_id: LAB });
}
