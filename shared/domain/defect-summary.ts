// Counts of noted items for the condition page's summary line.
import type { DefectSeverity } from "./condition-rules.ts";

export interface SummarisableDefect {
  zone: string;
  severity: DefectSeverity;
  safetyRelevant?: boolean | null;
}

export interface DefectSummary {
  total: number;
  byZone: Record<string, number>;
  bySeverity: Record<DefectSeverity, number>;
  /** Items marked as affecting safety; null when any item has not been assessed and none is marked. */
  affectingSafety: number | null;
  sentence: string;
}

/**
 * "None affecting safety" is a claim, so it is made only when every item was
 * explicitly assessed as not affecting safety; otherwise the clause is left out.
 */
export function summariseDefects(defects: readonly SummarisableDefect[] | null | undefined): DefectSummary {
  const items = defects ?? [];
  const byZone: Record<string, number> = {};
  const bySeverity: Record<DefectSeverity, number> = { minor: 0, moderate: 0, major: 0 };
  for (const d of items) {
    byZone[d.zone] = (byZone[d.zone] ?? 0) + 1;
    if (d.severity in bySeverity) bySeverity[d.severity] += 1;
  }
  const marked = items.filter((d) => d.safetyRelevant === true).length;
  const allAssessed = items.every((d) => typeof d.safetyRelevant === "boolean");
  const affectingSafety = marked > 0 || allAssessed ? marked : null;

  const total = items.length;
  const noted = `${total} ${total === 1 ? "item" : "items"} noted`;
  let sentence: string;
  if (total === 0) sentence = "No items noted.";
  else if (affectingSafety === null) sentence = `${noted}.`;
  else if (affectingSafety === 0) sentence = `${noted}, none affecting safety.`;
  else sentence = `${noted}, ${affectingSafety} affecting safety.`;
  return { total, byZone, bySeverity, affectingSafety, sentence };
}
