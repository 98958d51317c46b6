/** zod schemas for the engine's plain-data inputs; forms and routes validate with these. */
import { z } from "zod";
import { PARAMETERS, acceptsUnit, findParameter } from "./parameters.ts";
import { UNITS, type UnitId } from "./units.ts";
import { validateBuyerRequirement } from "./requirement.ts";
import { OIV_SULPHATE_CASES } from "./markets/types.ts";

const unitIds = Object.keys(UNITS) as [UnitId, ...UnitId[]];
const parameterIds = PARAMETERS.map((p) => p.id) as [string, ...string[]];
const finite = z.number({ error: "Enter a number." }).refine(Number.isFinite, { error: "Enter a finite number." });

export const guardBandSchema = z.object({
  kind: z.enum(["expanded", "multiple-of-u"]),
  k: z.number().gt(0, { error: "k must be above 0." }).lte(5, { error: "k must be at most 5." }),
});

export const decisionRuleSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("simple") }),
  z.object({ kind: z.literal("guarded"), guard: guardBandSchema }),
  z.object({ kind: z.literal("non-binary"), guard: guardBandSchema }),
]);

/** A buyer's requirement row; every error of validateBuyerRequirement becomes a field error. */
export const buyerRequirementSchema = z
  .object({
    parameter: z.enum(parameterIds, { error: "Choose a parameter from the catalogue." }),
    unit: z.enum(unitIds, { error: "Choose a unit." }),
    lower: finite.nullish(),
    upper: finite.nullish(),
    target: finite.nullish(),
    rule: decisionRuleSchema,
  })
  .superRefine((row, ctx) => {
    for (const issue of validateBuyerRequirement(row)) {
      if (issue.severity === "error") ctx.addIssue({ code: "custom", path: [issue.field], message: issue.message });
    }
  });

export const wineProfileSchema = z.object({
  colour: z.enum(["red", "white", "rose"]),
  category: z.enum(["still", "sparkling", "quality-sparkling", "semi-sparkling", "liqueur"]),
  sugarGPerL: z.number().min(0).max(600).optional(),
  harvestYear: z.number().int().min(1900).max(2200).optional(),
  alcoholPercentVol: z.number().min(0).max(25).optional(),
  euSo2Derogation: z.union([z.literal(300), z.literal(350), z.literal(400)]).optional(),
  euVaDerogation: z.union([z.literal(24.48), z.literal(25), z.literal(30), z.literal(35)]).optional(),
  euZonesAB: z.boolean().optional(),
  oivSweetWhiteSo2Exception: z.boolean().optional(),
  oivSulphateCase: z.enum(OIV_SULPHATE_CASES).optional(),
  cryoliteTreatedVineyard: z.boolean().optional(),
  usHighBrixJuice: z.boolean().optional(),
  filtered: z.boolean().optional(),
  organic: z.boolean().optional(),
  protectedOrigin: z.enum(["pdo", "pgi", "none"]).optional(),
  overripeGrapes: z.boolean().optional(),
  liqueurFromUnfermentedMust: z.boolean().optional(),
  sparklingCategory: z.enum(["sparkling", "quality", "quality-aromatic", "aerated"]).optional(),
});

export const readingSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("value"), value: finite }),
  z.object({ kind: z.literal("below"), limit: finite.min(0).nullable() }),
  z.object({ kind: z.literal("above"), limit: finite.min(0) }),
  z.object({ kind: z.literal("presence"), present: z.boolean() }),
]);

export const resultInputSchema = z.object({
  reading: readingSchema,
  unit: z.enum(unitIds),
  uncertainty: z
    .object({
      kind: z.enum(["expanded", "standard", "relative"]),
      value: finite.min(0),
      k: z.number().gt(0, { error: "A coverage factor k must be above 0." }).lte(5).optional(),
    })
    .nullish(),
  densityGPerMl: z.number().gt(0.5).lt(2).optional(),
});

/** A result for a given parameter: the unit must be one the parameter accepts, and presence must match. */
export function resultForParameterSchema(parameterId: string) {
  const p = findParameter(parameterId);
  return resultInputSchema.superRefine((r, ctx) => {
    if (!p) return ctx.addIssue({ code: "custom", path: ["unit"], message: `Unknown parameter "${parameterId}".` });
    if (!acceptsUnit(p, r.unit)) ctx.addIssue({ code: "custom", path: ["unit"], message: `${r.unit} is not a unit for ${p.name}.` });
    if ((p.kind === "presence") !== (r.reading.kind === "presence")) {
      ctx.addIssue({
        code: "custom",
        path: ["reading"],
        message: p.kind === "presence" ? `${p.name} is reported as present or absent.` : `${p.name} needs a numeric result.`,
      });
    }
  });
}
