import { SERVICE_KINDS, LABELS } from "../../../../shared/constants/vehicle.ts";
import type { OdometerFlag } from "../../../../shared/domain/service.ts";
import type { ServiceRow } from "./form-model.ts";

const cell = "min-h-11 w-full rounded-md border border-line-strong bg-paper-raised px-2 aria-[invalid=true]:border-brick";

/** Dated service entries. An odometer that goes down is flagged beside the entry, never refused. */
export function ServiceHistoryEditor({
  rows, onChange, errors, flags, disabled,
}: { rows: ServiceRow[]; onChange: (rows: ServiceRow[]) => void; errors: Record<string, string>; flags: OdometerFlag[]; disabled: boolean }) {
  const set = (i: number, key: keyof ServiceRow, value: string) => onChange(rows.map((r, j) => (j === i ? { ...r, [key]: value } : r)));
  const flagged = new Map(flags.map((f) => [f.laterIndex, f]));
  return (
    <div className="flex flex-col gap-3">
      <h3 className="text-base font-bold">Service history</h3>
      {rows.length === 0 ? <p className="text-sm text-ink-soft">No entries yet. Add each stamp in the book or each invoice.</p> : null}
      <ol className="flex flex-col gap-3">
        {rows.map((r, i) => {
          const err = (k: string) => errors[`serviceHistory.${i}.${k}`];
          const flag = flagged.get(i);
          return (
            <li key={i} className="rounded-md border border-line bg-paper p-3">
              <div className="grid gap-2 sm:grid-cols-[9rem_8rem_1fr_1fr]">
                <label className="text-xs font-bold">Date<input type="date" className={cell} value={r.date} disabled={disabled} aria-invalid={Boolean(err("date"))} onChange={(e) => set(i, "date", e.target.value)} /></label>
                <label className="text-xs font-bold">Odometer (km)<input inputMode="numeric" className={`${cell} figures`} value={r.odometerKm} disabled={disabled} aria-invalid={Boolean(err("odometerKm"))} onChange={(e) => set(i, "odometerKm", e.target.value)} /></label>
                <label className="text-xs font-bold">Kind
                  <select className={cell} value={r.kind} disabled={disabled} aria-invalid={Boolean(err("kind"))} onChange={(e) => set(i, "kind", e.target.value)}>
                    {SERVICE_KINDS.map((k) => <option key={k} value={k}>{LABELS.serviceKind[k]}</option>)}
                  </select>
                </label>
                <label className="text-xs font-bold">Workshop<input className={cell} value={r.workshop} disabled={disabled} onChange={(e) => set(i, "workshop", e.target.value)} /></label>
              </div>
              <label className="mt-2 block text-xs font-bold">Notes<input className={cell} value={r.notes} disabled={disabled} onChange={(e) => set(i, "notes", e.target.value)} /></label>
              {["date", "odometerKm", "kind", "workshop", "notes"].map((k) => (err(k) ? <p key={k} className="mt-1 text-sm font-bold text-brick">{err(k)}</p> : null))}
              {flag ? (
                <p className="mt-2 rounded-sm border-l-4 border-ochre bg-ochre-wash px-2 py-1 text-sm">
                  <strong>Odometer went down:</strong> {flag.laterKm.toLocaleString()} km here, after {flag.earlierKm.toLocaleString()} km on{" "}
                  {flag.earlierDate}. Check the book or invoice and explain it in the notes; do not advertise the reading as verified until it is
                  resolved.
                </p>
              ) : null}
              {!disabled ? (
                <button type="button" className="mt-2 min-h-11 text-sm font-bold text-brick" onClick={() => onChange(rows.filter((_, j) => j !== i))}>
                  Remove this entry
                </button>
              ) : null}
            </li>
          );
        })}
      </ol>
      {!disabled ? (
        <button
          type="button"
          className="self-start min-h-11 rounded-md border border-line-strong px-3 font-bold text-signal hover:bg-signal-wash"
          onClick={() => onChange([...rows, { date: "", odometerKm: "", kind: "scheduled", workshop: "", notes: "" }])}
        >
          Add a service entry
        </button>
      ) : null}
    </div>
  );
}
