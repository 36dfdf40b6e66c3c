import type { PublicDefect } from "../../../../../shared/schemas/public.ts";
import { kindLabel, severityLabel } from "../../format.ts";

/** The same mark as the staff walk-around's pin: a rounded square with the number, its outline heavier with severity. */
const WEIGHT: Record<PublicDefect["severity"], string> = { minor: "border-2", moderate: "border-[3px]", major: "border-[5px]" };

export function DefectNumber({ defect, small = false }: { defect: Pick<PublicDefect, "number" | "severity">; small?: boolean }) {
  return (
    <span
      className={`fr-pin-mark flex shrink-0 items-center justify-center rounded-md ${WEIGHT[defect.severity]} border-ink bg-paper-raised font-bold text-ink figures ${small ? "size-8 text-sm" : "size-9 text-base"}`}
    >
      {defect.number}
    </span>
  );
}

export const defectName = (d: PublicDefect) => `${severityLabel(d.severity).toLowerCase()} ${kindLabel(d.kind).toLowerCase()}`;

/**
 * A pin on a photo: a button placed at the pin's fractions of the picture, the severity spelt out under the number so
 * the mark never relies on colour. Pressing it picks the matching row of the list. Its name is the number and the
 * severity as shown, then the kind: "1 minor scratch".
 */
export function DefectPinButton({ defect, selected, onSelect }: { defect: PublicDefect; selected: boolean; onSelect: () => void }) {
  const pin = defect.pin!;
  return (
    <button
      type="button"
      id={`pin-${defect.number}`}
      onClick={onSelect}
      aria-pressed={selected}
      aria-controls={`defect-${defect.number}`}
      // The name starts with what the pin shows ("1 minor"), so a person speaking what they see can press it (WCAG 2.5.3).
      aria-label={`${defect.number} ${defectName(defect)}`}
      className={`fr-pin absolute flex -translate-x-1/2 -translate-y-1/2 flex-col items-center rounded-md p-0.5 ${selected ? "z-10 outline-3 outline-offset-1 outline-signal" : ""}`}
      style={{ left: `${pin.x * 100}%`, top: `${pin.y * 100}%` }}
    >
      <span className="shadow-[0_0_0_2px_var(--color-paper-raised)] rounded-md">
        <DefectNumber defect={defect} />
      </span>
      {/* Not drawn in a flex column, but it makes the visible text "1 minor" rather than "1minor". */}{" "}
      <span className="fr-pin-word mt-0.5 rounded-sm bg-paper-raised px-1 text-xs font-bold leading-4 text-ink">{severityLabel(defect.severity).toLowerCase()}</span>
    </button>
  );
}
