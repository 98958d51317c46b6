import { ruleLabel, type DecisionRule } from "../../../shared/engine/index.ts";

/** The decision rules a buyer picks from; each maps to an engine rule. */
export const RULE_PRESETS: { id: string; rule: DecisionRule }[] = [
  { id: "non-binary-U", rule: { kind: "non-binary", guard: { kind: "expanded", k: 2 } } },
  { id: "guarded-U", rule: { kind: "guarded", guard: { kind: "expanded", k: 2 } } },
  { id: "guarded-1.64u", rule: { kind: "guarded", guard: { kind: "multiple-of-u", k: 1.64 } } },
  { id: "simple", rule: { kind: "simple" } },
];

export const presetOf = (rule: DecisionRule) => RULE_PRESETS.find((p) => JSON.stringify(p.rule) === JSON.stringify(rule))?.id ?? "custom";

export const ruleOptions = (current: DecisionRule) => {
  const options = RULE_PRESETS.map((p) => ({ value: p.id, label: ruleLabel(p.rule) }));
  return presetOf(current) === "custom" ? [...options, { value: "custom", label: ruleLabel(current) }] : options;
};
