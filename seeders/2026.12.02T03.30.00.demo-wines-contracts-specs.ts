/**
 * Demo wines, contracts, spec versions and past lots with results (all fictional); the results are
 * submitted through the same service producers use. "Sentier Rouge"
 * has two vintages of results but no spec yet, so a buyer can draft one and backtest it.
 */
import type { QueryInterface } from "sequelize";
import type { MigrationParams } from "umzug";
import { SPEC_TEMPLATES } from "../shared/specs/templates.ts";
import type { AnalysisStage } from "../shared/lots/vocabulary.ts";
import { useDemoServices } from "./support/demo-services.ts";
import { party, reported } from "../tests/support/factories.ts";

const now = new Date("2026-11-20T09:00:00Z");
const stamps = { created_at: now, updated_at: now };

/** What the law needs to know of the two Loire wines (an appellation wine from zones A/B, filtered). */
const LOIRE_PDO = {
  organic: false,
  protectedOrigin: "pdo",
  filtered: true,
  euZonesAB: true,
  oivSulphateCase: "none",
  cryoliteTreatedVineyard: false,
};

const WINES = [
  {
    id: 1,
    retailer_org_id: 1,
    producer_org_id: 2,
    name: "Sentier Blanc",
    colour: "white",
    category: "still",
    region: "Loire Valley",
    markets: ["GB", "EU", "OIV"],
    nominal_sugar_g_per_l: 2.5,
    nominal_alcohol_percent_vol: 12.5,
    law_facts: LOIRE_PDO,
  },
  {
    id: 2,
    retailer_org_id: 1,
    producer_org_id: 2,
    name: "Sentier Rouge",
    colour: "red",
    category: "still",
    region: "Loire Valley",
    markets: ["GB", "EU", "OIV"],
    nominal_sugar_g_per_l: 1.8,
    nominal_alcohol_percent_vol: 13,
    law_facts: LOIRE_PDO,
  },
  {
    id: 3,
    retailer_org_id: 1,
    producer_org_id: 3,
    name: "Kestrel Flats Shiraz (bulk)",
    colour: "red",
    category: "still",
    region: "Riverland, South Australia",
    markets: ["GB", "EU", "OIV"],
    nominal_sugar_g_per_l: 3.2,
    nominal_alcohol_percent_vol: 14,
    law_facts: { organic: false, protectedOrigin: "none", euZonesAB: false, oivSulphateCase: "none" },
  },
  {
    id: 4,
    retailer_org_id: 1,
    producer_org_id: 4,
    name: "Valsorda Rosato Frizzante",
    colour: "rose",
    category: "semi-sparkling",
    region: "Veneto",
    markets: ["EU", "US"],
    nominal_sugar_g_per_l: 9,
    nominal_alcohol_percent_vol: 11,
    law_facts: { organic: false, protectedOrigin: "pgi", filtered: true, usHighBrixJuice: false },
  },
];

const CONTRACTS = [
  { id: 1, reference: "HG-C-2024-017", retailer_org_id: 1, producer_org_id: 2, wine_id: 1, starts_on: "2024-01-01", ends_on: "2027-12-31" },
  { id: 2, reference: "HG-C-2025-021", retailer_org_id: 1, producer_org_id: 2, wine_id: 2, starts_on: "2025-03-01", ends_on: null },
  { id: 3, reference: "HG-C-2024-009", retailer_org_id: 1, producer_org_id: 3, wine_id: 3, starts_on: "2024-06-01", ends_on: "2026-12-31" },
  { id: 4, reference: "HG-C-2025-030", retailer_org_id: 1, producer_org_id: 4, wine_id: 4, starts_on: "2025-09-01", ends_on: null },
];

const template = (id: string) => SPEC_TEMPLATES.find((t) => t.id === id)!.rows;

const VERSIONS = [
  {
    id: 1,
    contract_id: 1,
    number: 1,
    status: "agreed",
    title: "Sentier Blanc from the 2023 vintage",
    vintage_from: 2023,
    vintage_to: null,
    stages: ["pre_filling", "final_check", "pre_shipment"],
    rows: template("still-white"),
    decided_by: 5,
  },
  {
    id: 2,
    contract_id: 3,
    number: 1,
    status: "agreed",
    title: "Shiraz in flexitank",
    vintage_from: 2024,
    vintage_to: null,
    stages: ["pre_shipment", "on_arrival"],
    rows: template("still-red").map((r) => ({ ...r, stages: ["pre_shipment", "on_arrival"] as typeof r.stages })),
    decided_by: 7,
  },
  {
    id: 3,
    contract_id: 4,
    number: 1,
    status: "draft",
    title: "Rosato, first draft",
    vintage_from: 2025,
    vintage_to: null,
    stages: ["pre_filling", "pre_shipment"],
    rows: template("still-white")
      .slice(0, 6)
      .map((r) => ({ ...r, stages: ["pre_filling"] as typeof r.stages })),
    decided_by: null,
  },
];

// Deterministic pseudo-random numbers, so the demo is the same on every machine.
let seed = 20261202;
const rand = () => (seed = (seed * 1664525 + 1013904223) >>> 0) / 2 ** 32;
const around = (centre: number, spread: number, digits: number) => Number((centre + (rand() - 0.5) * spread).toFixed(digits));

type ResultSpec = [parameter: string, unit: string, value: number];

function redResults(va: number): ResultSpec[] {
  return [
    ["alcohol", "% vol", around(13.1, 0.5, 2)],
    ["free_so2", "mg/L", around(27, 8, 0)],
    ["total_so2", "mg/L", around(88, 25, 0)],
    ["volatile_acidity", "g/L as acetic acid", va],
    ["residual_sugar", "g/L", around(1.9, 0.8, 1)],
    ["total_acidity", "g/L as tartaric acid", around(5.6, 0.6, 2)],
    ["ph", "pH", around(3.58, 0.16, 2)],
    ["malic_acid", "g/L", around(0.1, 0.12, 2)],
    ["copper", "mg/L", around(0.18, 0.2, 2)],
  ];
}

function whiteResults(): ResultSpec[] {
  return [
    ["alcohol", "% vol", around(12.4, 0.5, 2)],
    ["free_so2", "mg/L", around(32, 10, 0)],
    ["total_so2", "mg/L", around(118, 30, 0)],
    ["volatile_acidity", "g/L as acetic acid", around(0.38, 0.16, 2)],
    ["residual_sugar", "g/L", around(2.4, 1.2, 1)],
    ["total_acidity", "g/L as tartaric acid", around(6.4, 0.8, 2)],
    ["ph", "pH", around(3.22, 0.12, 2)],
    ["heat_test_haze", "NTU", around(0.9, 1, 2)],
    ["copper", "mg/L", around(0.2, 0.2, 2)],
  ];
}

interface LotSeed {
  contract: number;
  vintage: number;
  code: string;
  litres: number;
  container: "bottles" | "flexitank";
  date: string;
  analyses: { stage: AnalysisStage; lab: string; accreditation: string | null; date: string; results: ResultSpec[] }[];
}

/** Who sends each contract's results: the producer's quality member. */
const PRODUCER_QUALITY: Record<number, string> = {
  1: "elise.carbonnel@troissentes.test",
  2: "elise.carbonnel@troissentes.test",
  3: "priya.anand@kestrelflats.test",
};

const OWN_LAB = "Domaine des Trois Sentes cellar laboratory";
const LOTS: LotSeed[] = [
  ...[0.48, 0.5, 0.53].map((va, i) => ({
    contract: 2,
    vintage: 2023,
    code: `SR-23-${i + 1}`,
    litres: 9000,
    container: "bottles" as const,
    date: `2024-0${i + 3}-15`,
    analyses: [{ stage: "pre_filling" as const, lab: OWN_LAB, accreditation: null, date: `2024-0${i + 3}-02`, results: redResults(va) }],
  })),
  ...[0.58, 0.61, 0.63, 0.52].map((va, i) => ({
    contract: 2,
    vintage: 2024,
    code: `SR-24-${i + 1}`,
    litres: 9000,
    container: "bottles" as const,
    date: `2025-0${i + 3}-15`,
    analyses: [{ stage: "pre_filling" as const, lab: OWN_LAB, accreditation: null, date: `2025-0${i + 3}-03`, results: redResults(va) }],
  })),
  ...[2023, 2023, 2024, 2024, 2024].map((vintage, i) => ({
    contract: 1,
    vintage,
    code: `SB-${vintage % 100}-${i + 1}`,
    litres: 12000,
    container: "bottles" as const,
    date: `${vintage + 1}-0${(i % 5) + 2}-20`,
    analyses: [
      {
        stage: "pre_filling" as const,
        lab: OWN_LAB,
        accreditation: null,
        date: `${vintage + 1}-0${(i % 5) + 2}-05`,
        results: whiteResults(),
      },
    ],
  })),
  ...[1, 2].map((n) => {
    // The bulk spec also asks, at both stages, for dissolved oxygen, 4-ethylphenol and a sterility count.
    const before: ResultSpec[] = [
      ...redResults(around(0.5, 0.08, 2)),
      ["dissolved_oxygen", "mg/L", around(0.8, 0.3, 2)],
      ["ethylphenol_4", "µg/L", around(120, 60, 0)],
      ["sterility_count", "CFU/100 mL", 0],
    ];
    const after = before.map(([p, u, v]): ResultSpec => [
      p,
      u,
      p === "free_so2" ? v - (n === 1 ? 6 : 14) : p === "volatile_acidity" ? Number((v + 0.03).toFixed(2)) : v,
    ]);
    return {
      contract: 3,
      vintage: 2024,
      code: `KF-SH-24-F${n}`,
      litres: 24000,
      container: "flexitank" as const,
      date: `2025-0${n + 4}-10`,
      analyses: [
        {
          stage: "pre_shipment" as const,
          lab: "Riverland Wine Analysis Services",
          accreditation: "NATA 18844",
          date: `2025-0${n + 2}-20`,
          results: before,
        },
        {
          stage: "on_arrival" as const,
          lab: "Northgate Oenology Laboratory",
          accreditation: "UKAS 4412",
          date: `2025-0${n + 4}-12`,
          results: after,
        },
      ],
    };
  }),
];

export async function up({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkInsert(
    "wines",
    WINES.map((w) => ({ ...w, markets: JSON.stringify(w.markets), law_facts: JSON.stringify(w.law_facts), ...stamps })),
  );
  await qi.bulkInsert(
    "contracts",
    // The demo's producers accepted their contracts when they were opened.
    CONTRACTS.map((c) => ({ ...c, ...stamps, producer_accepted_at: stamps.created_at })),
  );
  await qi.bulkInsert(
    "spec_versions",
    VERSIONS.map((v) => ({
      id: v.id,
      contract_id: v.contract_id,
      number: v.number,
      status: v.status,
      title: v.title,
      vintage_from: v.vintage_from,
      vintage_to: v.vintage_to,
      stages: JSON.stringify(v.stages),
      based_on_version_id: null,
      lock_version: 0,
      created_by: 2,
      sent_at: v.status === "draft" ? null : now,
      decided_at: v.status === "agreed" ? now : null,
      decided_by: v.decided_by,
      ...stamps,
    })),
  );
  await qi.bulkInsert(
    "spec_requirements",
    VERSIONS.flatMap((v) =>
      v.rows.map((r, i) => ({
        spec_version_id: v.id,
        position: i,
        parameter: r.parameter,
        unit: r.unit,
        lower: r.lower ?? null,
        upper: r.upper ?? null,
        target: r.target ?? null,
        method: r.method ?? null,
        rule: JSON.stringify(r.rule),
        severity: r.severity,
        stages: JSON.stringify(r.stages),
      })),
    ),
  );
  // Past lots keep their historical filling dates, so they go in as rows; their results go through the producers' service.
  useDemoServices(qi);
  let lotId = 0;
  for (const lot of LOTS) {
    lotId += 1;
    await qi.bulkInsert("lots", [
      {
        id: lotId,
        contract_id: lot.contract,
        vintage: lot.vintage,
        lot_code: lot.code,
        volume_litres: lot.litres,
        container: lot.container,
        planned_date: lot.date,
        market: "GB",
        ...stamps,
      },
    ]);
    const producer = await party(PRODUCER_QUALITY[lot.contract]!, "producer_quality");
    for (const a of lot.analyses) {
      await reported(producer, lotId, {
        stage: a.stage,
        laboratoryName: a.lab,
        accreditation: a.accreditation,
        sampleDate: a.date,
        results: a.results.map(([parameter, unit, value]): [string, string, string] => [parameter, String(value), unit]),
      });
    }
  }
}

export async function down({ context: qi }: MigrationParams<QueryInterface>) {
  await qi.bulkDelete("lots", { contract_id: CONTRACTS.map((c) => c.id) });
  await qi.bulkDelete("spec_versions", { contract_id: CONTRACTS.map((c) => c.id) });
  await qi.bulkDelete("contracts", { id: CONTRACTS.map((c) => c.id) });
  await qi.bulkDelete("wines", { id: WINES.map((w) => w.id) });
}
