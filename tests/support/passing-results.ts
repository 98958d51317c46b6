/**
 * Results that sit well inside every row a stage requires: halfway between two limits, half an
 * upper limit, or half as much again as a lower one. Tests change the one they want to fail.
 */
import { findParameter } from "../../shared/engine/index.ts";
import type { RequirementView } from "../../shared/specs/views.ts";
import type { Stage } from "../../shared/specs/vocabulary.ts";

export function passingResults(requirements: readonly RequirementView[], stage: Stage, overrides: Record<string, string> = {}) {
  return requirements
    .filter((r) => r.stages.includes(stage))
    .map((r) => {
      const presence = findParameter(r.parameter)?.kind === "presence";
      const mid = r.lower !== null && r.upper !== null ? (r.lower + r.upper) / 2 : r.upper !== null ? r.upper / 2 : (r.lower ?? 1) * 1.5;
      return {
        parameter: r.parameter,
        raw: overrides[r.parameter] ?? (presence ? "absent" : String(Number(mid.toPrecision(3)))),
        unit: r.unit,
        uncertainty: null,
      };
    });
}
