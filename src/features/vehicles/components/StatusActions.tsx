import { useState } from "react";
import { movesFrom } from "../../../../shared/domain/status.ts";
import type { Role } from "../../../../shared/constants/roles.ts";
import { useMoveStatus, type VehicleRecord } from "../api/vehicles.ts";
import { Notice } from "../../../components/feedback/Notice.tsx";

/** The moves this role can make from the vehicle's status. Publishing has its own checks and screen. */
export function StatusActions({ vehicle, role }: { vehicle: VehicleRecord; role: Role }) {
  const move = useMoveStatus(vehicle.id);
  const [note, setNote] = useState("");
  const moves = movesFrom(vehicle.status, role).filter((m) => !m.via);
  const publishable = movesFrom(vehicle.status, role).some((m) => m.via === "publish");
  if (!moves.length && !publishable) return <p className="text-sm text-ink-soft">No status moves are open to your role from here.</p>;
  return (
    <div className="flex flex-col gap-3">
      {move.error ? <Notice tone="danger" title={move.error.message} /> : null}
      <label className="text-sm font-bold" htmlFor="status-note">Note for the history (optional)</label>
      <input id="status-note" className="min-h-11 rounded-md border border-line-strong bg-paper-raised px-3" value={note} maxLength={500} onChange={(e) => setNote(e.target.value)} placeholder="e.g. Deposit taken by phone" />
      <div className="flex flex-wrap gap-2">
        {moves.map((m) => (
          <button
            key={m.to}
            type="button"
            disabled={move.isPending}
            className="min-h-11 rounded-md border border-line-strong bg-paper-raised px-3 font-bold hover:border-ink-soft"
            onClick={() => move.mutate({ version: vehicle.version, to: m.to, note: note || undefined }, { onSuccess: () => setNote("") })}
          >
            {m.label}
          </button>
        ))}
      </div>
      {publishable ? <p className="text-sm text-ink-soft">Going live happens by publishing, once the vehicle's readiness checks pass.</p> : null}
    </div>
  );
}
