/** Words of the spec-sheet workflow: analysis stages, version states, severities. */

export const STAGES = ["pre_filling", "final_check", "pre_shipment", "on_arrival"] as const;
export type Stage = (typeof STAGES)[number];
export const STAGE_LABELS: Record<Stage, string> = {
  pre_filling: "Pre-filling",
  final_check: "Final check before filling",
  pre_shipment: "Pre-shipment",
  on_arrival: "On arrival",
};

/**
 * A version's life: the buyer drafts it, sends it to the producer, who agrees or asks for changes.
 * An agreed version is replaced when a later one is agreed; the buyer can withdraw a version.
 */
export const SPEC_STATUSES = ["draft", "with_producer", "changes_requested", "agreed", "replaced", "withdrawn"] as const;
export type SpecStatus = (typeof SPEC_STATUSES)[number];
export const SPEC_STATUS_LABELS: Record<SpecStatus, string> = {
  draft: "Draft",
  with_producer: "With producer",
  changes_requested: "Changes requested",
  agreed: "Agreed",
  replaced: "Replaced",
  withdrawn: "Withdrawn",
};

export const SEVERITIES = ["critical", "major", "minor"] as const;
export type Severity = (typeof SEVERITIES)[number];
export const SEVERITY_LABELS: Record<Severity, string> = {
  critical: "Critical (legal or safety)",
  major: "Major",
  minor: "Minor",
};

export const WINE_CATEGORIES = ["still", "sparkling", "quality-sparkling", "semi-sparkling", "liqueur"] as const;
export const WINE_CATEGORY_LABELS: Record<(typeof WINE_CATEGORIES)[number], string> = {
  still: "Still",
  sparkling: "Sparkling",
  "quality-sparkling": "Quality sparkling",
  "semi-sparkling": "Semi-sparkling",
  liqueur: "Liqueur",
};
export const COLOURS = ["red", "white", "rose"] as const;
export const COLOUR_LABELS: Record<(typeof COLOURS)[number], string> = { red: "Red", white: "White", rose: "Rosé" };
