import type { VehicleEvidence } from "../api/evidence.ts";
import { formatConditionIndex } from "../../../../shared/domain/display.ts";
import { SEVERITY_LABELS, ZONE_LABELS } from "../../../../shared/constants/evidence.ts";

/** The index as a number with its sentence, the counts, and the cautions; never a grade or a colour code. */
export function ConditionSummary({ evidence }: { evidence: VehicleEvidence }) {
  const { condition, cautions, zones } = evidence;
  const unchecked = zones.filter((z) => z.state === "unchecked");
  return (
    <div className="flex flex-col gap-3">
      <div>
        <p className="text-4xl font-bold figures" data-testid="condition-index">
          {condition.index == null ? "—" : formatConditionIndex(condition.index)}
          <span className="ml-1 text-base font-normal text-ink-soft">/ 100</span>
        </p>
        <p className="text-sm">{condition.index == null ? "Record the tyres or the checks to work out the condition index." : condition.summary.sentence}</p>
      </div>
      {condition.summary.total ? (
        <p className="text-sm text-ink-soft">
          {(["major", "moderate", "minor"] as const).filter((s) => condition.summary.bySeverity[s]).map((s) => `${condition.summary.bySeverity[s]} ${SEVERITY_LABELS[s].toLowerCase()}`).join(", ")}
        </p>
      ) : null}
      {unchecked.length ? (
        <p className="text-sm"><strong>{unchecked.length} zone{unchecked.length === 1 ? "" : "s"} still to check:</strong> {unchecked.map((z) => ZONE_LABELS[z.zone]).join(", ")}.</p>
      ) : (
        <p className="text-sm">Every zone checked.</p>
      )}
      {cautions.length ? (
        <ul className="flex flex-col gap-2">
          {cautions.map((c) => (
            <li key={c.code} className={`rounded-sm border-l-4 px-3 py-2 text-sm ${c.level === "block" ? "border-brick bg-brick-wash" : "border-ochre bg-ochre-wash"}`}>
              <strong>{c.level === "block" ? "Safety: " : "Advisory: "}</strong>
              {c.text}
            </li>
          ))}
        </ul>
      ) : null}
      <details className="text-sm">
        <summary className="cursor-pointer font-bold text-signal">How this is scored</summary>
        <div className="mt-2 flex flex-col gap-1 text-ink-soft">
          {condition.explanation.map((line, i) => <p key={i}>{line}</p>)}
        </div>
      </details>
    </div>
  );
}
