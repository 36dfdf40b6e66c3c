import { LABELS, type VehicleStatus } from "../../../../shared/constants/vehicle.ts";

/** A status is a word in a hairline box; the shape differs for states a buyer can see (live, reserved). */
export function StatusBadge({ status }: { status: VehicleStatus }) {
  const publicFacing = status === "live" || status === "reserved";
  const gone = status === "sold" || status === "archived";
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-sm border px-2 py-0.5 text-xs font-bold uppercase tracking-wide ${
        publicFacing ? "border-signal text-signal-strong" : gone ? "border-line text-ink-faint" : "border-line-strong text-ink-soft"
      }`}
    >
      {publicFacing ? <span aria-hidden className="size-1.5 rounded-full bg-signal" /> : null}
      {LABELS.status[status]}
    </span>
  );
}
