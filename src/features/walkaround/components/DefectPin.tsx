import { SEVERITY_LABELS, type Severity } from "../../../../shared/constants/evidence.ts";

const WEIGHT: Record<Severity, string> = { minor: "border-2", moderate: "border-[3px]", major: "border-[5px]" };

interface Props {
  number: number;
  severity: Severity;
  x: number;
  y: number;
  label: string;
  onClick?: () => void;
  selected?: boolean;
}

/**
 * Our defect mark: a rounded square tag with the defect's number; the outline gets heavier with severity and the
 * severity is spelt out under it, so the mark never relies on colour.
 */
export function DefectPin({ number, severity, x, y, label, onClick, selected }: Props) {
  return (
    <button
      type="button"
      onClick={(e) => {
        e.stopPropagation();
        onClick?.();
      }}
      aria-label={`Defect ${number}: ${label}`}
      className="absolute flex -translate-x-1/2 -translate-y-1/2 flex-col items-center"
      style={{ left: `${x * 100}%`, top: `${y * 100}%` }}
    >
      <span className={`flex size-9 items-center justify-center rounded-md ${WEIGHT[severity]} border-ink bg-paper-raised text-base font-bold text-ink shadow-[0_0_0_2px_var(--color-paper-raised)] figures ${selected ? "outline-3 outline-signal" : ""}`}>
        {number}
      </span>
      <span className="mt-0.5 rounded-sm bg-paper-raised/95 px-1 text-[0.7rem] font-bold leading-4 text-ink">{SEVERITY_LABELS[severity].toLowerCase()}</span>
    </button>
  );
}
