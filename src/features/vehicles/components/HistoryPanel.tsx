import { useVehicleHistory } from "../api/vehicles.ts";
import { LABELS } from "../../../../shared/constants/vehicle.ts";
import { Loading, Notice } from "../../../components/feedback/Notice.tsx";

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });
// Audit values are JSON: strings as they are, numbers, booleans, lists and objects as JSON writes them.
const show = (v: unknown) => (v === null || v === undefined || v === "" ? "—" : typeof v === "string" ? v : JSON.stringify(v).slice(0, 120));
const statusLabel = (s: string | null) => (s ? ((LABELS.status as Record<string, string>)[s] ?? s) : "—");

/** The vehicle's path and the audit trail: who changed which field, from what, to what, when. */
export function HistoryPanel({ id }: { id: number }) {
  const h = useVehicleHistory(id);
  if (h.isPending) return <Loading label="Loading history…" />;
  if (h.isError) return <Notice tone="danger" title={h.error.message} />;
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h3 className="mb-2 font-bold">Status</h3>
        <ol className="flex flex-col gap-2 text-sm">
          {h.data.statusHistory.map((e, i) => (
            <li key={i} className="border-l-2 border-line-strong pl-3">
              <span className="font-bold">{e.from ? `${statusLabel(e.from)} → ${statusLabel(e.to)}` : statusLabel(e.to)}</span>
              <span className="text-ink-soft"> · {when(e.at)} · {e.by ?? "system"}</span>
              {e.note ? <div>{e.note}</div> : null}
            </li>
          ))}
        </ol>
      </div>
      <div>
        <h3 className="mb-2 font-bold">Changes</h3>
        {h.data.audit.length === 0 ? <p className="text-sm text-ink-soft">No changes recorded yet.</p> : null}
        <ol className="flex flex-col gap-3 text-sm">
          {h.data.audit.map((a, i) => (
            <li key={i} className="border-l-2 border-line pl-3">
              <div className="text-ink-soft">{when(a.at)} · {a.by ?? "system"} · {a.action.replace(/_/g, " ")}</div>
              {a.after && a.action !== "vehicle_created" ? (
                <ul className="mt-1">
                  {Object.keys(a.after).map((k) => (
                    <li key={k}>
                      <span className="font-bold">{k}</span>: <span className="text-ink-soft line-through decoration-1">{show(a.before?.[k])}</span> → {show(a.after![k])}
                    </li>
                  ))}
                </ul>
              ) : null}
            </li>
          ))}
        </ol>
      </div>
    </div>
  );
}
