import { THIN_SPACE } from "../../../../shared/domain/display.ts";
import { DASH } from "../format.ts";

/**
 * A formatted quantity ("773 km", "≈ 773 km", "8.8 L/100 km") with its unit in the lighter weight, never split
 * across lines. The formatter's last thin space separates the number from the unit.
 */
export function Qty({ text, missing = DASH }: { text: string | null | undefined; missing?: string }) {
  if (!text) return <>{missing}</>;
  const at = text.lastIndexOf(THIN_SPACE);
  if (at <= 0) return <span className="whitespace-nowrap figures">{text}</span>;
  return (
    <span className="whitespace-nowrap figures">
      {text.slice(0, at)}
      <span className="unit">
        {THIN_SPACE}
        {text.slice(at + 1)}
      </span>
    </span>
  );
}
