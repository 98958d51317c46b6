/**
 * Northgate Oenology Laboratory's price list (invented prices, in cents), and one audit order that
 * Harbourline's finance staff placed but have not paid yet, so the finance page has something to show.
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";

const LAB = 5;
const PRICES: [string, number][] = [
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
  const now = new Date();
  await qi.bulkInsert(
    "lab_prices",
    PRICES.map(([parameter, cents]) => ({ organisation_id: LAB, parameter, price_cents: cents, currency: "eur", updated_at: now })),
  );
  const [lot] = (await qi.sequelize.query("SELECT id FROM lots WHERE contract_id = 3 ORDER BY vintage DESC, id DESC LIMIT 1", {
    type: "SELECT" as never,
  })) as unknown as { id: number }[];
  if (!lot) return;
  const lines = [
    { parameter: "volatile_acidity", name: "Volatile acidity", unitCents: 1600, lots: 1, totalCents: 1600 },
    { parameter: "free_so2", name: "Free SO2", unitCents: 1400, lots: 1, totalCents: 1400 },
    { parameter: "dissolved_oxygen", name: "Dissolved oxygen", unitCents: 1500, lots: 1, totalCents: 1500 },
  ];
  await qi.bulkInsert("audit_orders", [
    {
      contract_id: 3,
      buyer_org_id: 1,
      producer_org_id: 3,
      laboratory_org_id: LAB,
      ordered_by: 3,
      stage: "pre_shipment",
      parameters: JSON.stringify(lines.map((l) => l.parameter)),
      lines: JSON.stringify(lines),
      amount_cents: 4500,
      currency: "eur",
      note: "Spot check before the flexitank leaves.",
      status: "awaiting_payment",
      paid_cents: 0,
      refunded_cents: 0,
      created_at: now,
      updated_at: now,
    },
  ]);
  const [order] = (await qi.sequelize.query("SELECT MAX(id) AS id FROM audit_orders", { type: "SELECT" as never })) as unknown as {
    id: number;
  }[];
  await qi.bulkInsert("audit_order_lots", [{ audit_order_id: order!.id, lot_id: lot.id }]);
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.sequelize.query("DELETE FROM audit_orders WHERE buyer_org_id = 1 AND note = 'Spot check before the flexitank leaves.'");
  await qi.bulkDelete("lab_prices", { organisation_id: LAB });
}
