import type { Stage } from "../specs/vocabulary.ts";
import { STAGE_LABELS } from "../specs/vocabulary.ts";

/** Analysis stages: the spec stages plus a re-test after treatment, which is judged like pre-filling. */
export const ANALYSIS_STAGES = ["pre_filling", "retest", "final_check", "pre_shipment", "on_arrival"] as const;
export type AnalysisStage = (typeof ANALYSIS_STAGES)[number];
export const ANALYSIS_STAGE_LABELS: Record<AnalysisStage, string> = { ...STAGE_LABELS, retest: "Re-test after treatment" };

/** The spec stage whose requirements an analysis stage is judged against. */
export const specStageFor = (s: AnalysisStage): Stage => (s === "retest" ? "pre_filling" : s);

export const CONTAINERS = ["bottles", "iso_tank", "flexitank"] as const;
export type Container = (typeof CONTAINERS)[number];
export const CONTAINER_LABELS: Record<Container, string> = { bottles: "Bottles", iso_tank: "Bulk, ISO tank", flexitank: "Bulk, flexitank" };
export const isBulk = (c: Container) => c !== "bottles";
