import { useId, type InputHTMLAttributes, type ReactNode } from "react";
import { describedBy, FieldNotes } from "../../../components/form/Field.tsx";

// The same control look as components/form/Field.tsx, sized for a gloved thumb: 48 px tall, 17 px text.
export const controlClass =
  "w-full min-w-0 min-h-12 rounded-md border border-line-strong bg-paper-raised px-3 py-2 text-base text-ink placeholder:text-ink-faint focus:border-signal disabled:bg-paper-sunk disabled:text-ink aria-[invalid=true]:border-brick aria-[invalid=true]:bg-brick-wash/40";

interface MeasureProps extends Omit<InputHTMLAttributes<HTMLInputElement>, "onChange"> {
  label: ReactNode;
  unit?: string;
  /** Marks the control invalid; the message itself is shown by `error` or, when `errorId` is given, by the caller. */
  invalid?: boolean;
  error?: string;
  errorId?: string;
  hint?: ReactNode;
  labelAction?: ReactNode;
  onValue: (value: string) => void;
}

/** A labelled input with its unit after it, the error under it (or in a shared list the caller places). */
export function Measure({ label, unit, invalid, error, errorId, hint, labelAction, onValue, className = "", ...rest }: MeasureProps) {
  const auto = useId();
  const id = rest.id ?? auto;
  const shared = errorId && invalid && !error ? errorId : null;
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <div className="flex min-h-6 items-end justify-between gap-2">
        <label htmlFor={id} className="text-sm font-bold text-ink">
          {label}
        </label>
        {labelAction}
      </div>
      <div className="flex items-center gap-1.5">
        <input
          {...rest}
          id={id}
          autoComplete="off"
          aria-invalid={Boolean(error || invalid)}
          aria-describedby={[shared, describedBy(id, error, hint)].filter(Boolean).join(" ") || undefined}
          className={`${controlClass} ${className}`}
          onChange={(e) => onValue(e.target.value)}
        />
        {unit ? <span className="unit shrink-0 text-sm">{unit}</span> : null}
      </div>
      {/* The status line at the foot of the screen says how many need attention, so each error is not an alert. */}
      <FieldNotes id={id} error={error} hint={hint} announce={false} />
    </div>
  );
}

/** A small tag that says what a row is in words (colour only adds). */
export function Tag({ children, tone = "plain" }: { children: ReactNode; tone?: "plain" | "safety" }) {
  return (
    <span
      className={`inline-flex items-center rounded-sm border px-1.5 py-0.5 text-xs font-bold uppercase tracking-wide ${
        tone === "safety" ? "border-brick text-brick" : "border-line-strong text-ink-soft"
      }`}
    >
      {children}
    </span>
  );
}
