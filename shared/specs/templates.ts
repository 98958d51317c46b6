/**
 * Starting points for a new spec sheet: typical parameters and ranges a buyer's technologist would
 * begin from. Every value is common practice (sources named where one exists) and meant to be edited.
 */
import type { SpecRowInput } from "./schemas.ts";
import { DEFAULT_DECISION_RULE } from "../engine/index.ts";

const all = ["pre_filling", "final_check", "pre_shipment", "on_arrival"] as const;
const preFill = ["pre_filling", "pre_shipment"] as const;
const row = (r: Omit<SpecRowInput, "rule" | "stages" | "severity"> & Partial<Pick<SpecRowInput, "stages" | "severity">>): SpecRowInput => ({
  rule: DEFAULT_DECISION_RULE,
  severity: "major",
  stages: [...preFill],
  ...r,
});

export interface SpecTemplate {
  id: string;
  name: string;
  description: string;
  rows: SpecRowInput[];
}

export const SPEC_TEMPLATES: readonly SpecTemplate[] = [
  {
    id: "still-white",
    name: "Still white or rosé",
    description:
      "Typical ranges for a dry still white or rosé (common practice; AWRI bottling guidance for oxygen, heat stability and turbidity).",
    rows: [
      row({ parameter: "alcohol", unit: "% vol", lower: 11, upper: 13.5, method: "OIV-MA-AS312-01", severity: "critical" }),
      row({ parameter: "free_so2", unit: "mg/L", lower: 25, upper: 40, method: "OIV-MA-AS323-04A", stages: [...all] }),
      row({ parameter: "total_so2", unit: "mg/L", upper: 150, method: "OIV-MA-AS323-04A", severity: "critical" }),
      row({
        parameter: "volatile_acidity",
        unit: "g/L as acetic acid",
        upper: 0.6,
        method: "OIV-MA-AS313-02",
        severity: "critical",
        stages: [...all],
      }),
      row({ parameter: "residual_sugar", unit: "g/L", upper: 4, method: "OIV-MA-AS311-02" }),
      row({ parameter: "total_acidity", unit: "g/L as tartaric acid", lower: 5.5, upper: 7.5, method: "OIV-MA-AS313-01" }),
      row({ parameter: "ph", unit: "pH", lower: 3.1, upper: 3.4 }),
      row({ parameter: "heat_test_haze", unit: "NTU", upper: 2, severity: "major" }),
      row({ parameter: "cold_stability_conductivity", unit: "%", upper: 5 }),
      row({ parameter: "turbidity", unit: "NTU", upper: 1, stages: ["final_check"] }),
      row({ parameter: "dissolved_oxygen", unit: "mg/L", upper: 0.5, stages: ["final_check"] }),
      row({ parameter: "carbon_dioxide", unit: "g/L", lower: 0.7, upper: 1.5, stages: ["final_check"] }),
      row({ parameter: "copper", unit: "mg/L", upper: 0.5, severity: "critical" }),
      row({ parameter: "iron", unit: "mg/L", upper: 5 }),
      row({ parameter: "sterility_count", unit: "CFU/100 mL", upper: 0, stages: ["final_check"], severity: "critical" }),
    ],
  },
  {
    id: "still-red",
    name: "Still red",
    description: "Typical ranges for a dry still red (common practice; AWRI bottling guidance for oxygen).",
    rows: [
      row({ parameter: "alcohol", unit: "% vol", lower: 12.5, upper: 14.5, method: "OIV-MA-AS312-01", severity: "critical" }),
      row({ parameter: "free_so2", unit: "mg/L", lower: 20, upper: 35, method: "OIV-MA-AS323-04A", stages: [...all] }),
      row({ parameter: "total_so2", unit: "mg/L", upper: 120, method: "OIV-MA-AS323-04A", severity: "critical" }),
      row({
        parameter: "volatile_acidity",
        unit: "g/L as acetic acid",
        upper: 0.7,
        method: "OIV-MA-AS313-02",
        severity: "critical",
        stages: [...all],
      }),
      row({ parameter: "residual_sugar", unit: "g/L", upper: 3, method: "OIV-MA-AS311-02" }),
      row({ parameter: "total_acidity", unit: "g/L as tartaric acid", lower: 5, upper: 6.5, method: "OIV-MA-AS313-01" }),
      row({ parameter: "ph", unit: "pH", lower: 3.4, upper: 3.8 }),
      row({ parameter: "malic_acid", unit: "g/L", upper: 0.2 }),
      row({ parameter: "dissolved_oxygen", unit: "mg/L", upper: 1, stages: ["final_check"] }),
      row({ parameter: "ethylphenol_4", unit: "µg/L", upper: 245 }),
      row({ parameter: "copper", unit: "mg/L", upper: 0.5, severity: "critical" }),
      row({ parameter: "sterility_count", unit: "CFU/100 mL", upper: 0, stages: ["final_check"], severity: "critical" }),
    ],
  },
];
