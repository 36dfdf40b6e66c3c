import { useState } from "react";
import { Link } from "react-router";
import type { VehicleDetail } from "../../vehicles/api/vehicles.ts";
import type { Role } from "../../../../shared/constants/roles.ts";
import { can } from "../../../../shared/permissions.ts";
import { usePublish } from "../api/publishing.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";

const SECTION_PATH = { record: "", photos: "photos", walkaround: "walkaround", checks: "checks" } as const;
const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });

/** Readiness as a checklist with links to what is missing, the publish action, and every revision so far. */
export function PublishPanel({ vehicle, role }: { vehicle: VehicleDetail; role: Role }) {
  const { readiness, publishing } = vehicle;
  const publish = usePublish(vehicle.id);
  const [reason, setReason] = useState("");
  const [done, setDone] = useState<string | null>(null);
  const canPublish = can(role, "vehicle.publish");
  const statusAllows = ["preparing", "live", "reserved", "withdrawn"].includes(vehicle.status);
  const base = `/app/vehicles/${vehicle.id}`;
  const fieldError = publish.error?.fields?.overrideReason;

  return (
    <div className="flex flex-col gap-4">
      <ul className="flex flex-col gap-1 text-sm" aria-label="Readiness">
        {readiness.items.map((i) => (
          <li key={i.code} className="flex gap-2">
            <span aria-hidden className={`mt-0.5 inline-flex size-5 shrink-0 items-center justify-center rounded-sm border text-xs font-bold ${i.ok ? "border-signal text-signal" : "border-brick text-brick"}`}>{i.ok ? "✓" : "!"}</span>
            <span>
              <span className="sr-only">{i.ok ? "Done: " : "Missing: "}</span>
              {i.ok ? i.label : <Link to={`${base}/${SECTION_PATH[i.section]}`.replace(/\/$/, "")}>{i.label}</Link>}
              {!i.ok ? <span className="block text-ink-soft">{i.detail}</span> : null}
            </span>
          </li>
        ))}
      </ul>
      {done ? <Notice tone="success" title={done} /> : null}
      {publish.error && !fieldError ? <Notice tone="danger" title={publish.error.message} /> : null}
      {canPublish && statusAllows ? (
        readiness.ready ? (
          <Button busy={publish.isPending} onClick={() => publish.mutate({ version: vehicle.version }, { onSuccess: (r) => setDone(`Revision ${r.revision.number} is live.`) })}>
            {publishing.revisions.length ? "Publish the changes" : "Publish"}
          </Button>
        ) : can(role, "publish.override") ? (
          <div className="flex flex-col gap-2 rounded-md border border-ochre bg-ochre-wash p-3">
            <label htmlFor="override" className="text-sm font-bold">Publish over the block (admin)</label>
            <textarea id="override" className="min-h-20 rounded-md border border-line-strong bg-paper-raised p-2 text-sm" value={reason} onChange={(e) => setReason(e.target.value)} placeholder="Why this vehicle may be published as it is. Recorded and shown to staff." />
            {fieldError ? <p className="text-sm font-bold text-brick">{fieldError}</p> : null}
            <Button tone="danger" busy={publish.isPending} onClick={() => publish.mutate({ version: vehicle.version, overrideReason: reason }, { onSuccess: (r) => (setDone(`Revision ${r.revision.number} is live, published over the block.`), setReason("")) })}>
              Publish with this reason
            </Button>
          </div>
        ) : (
          <p className="text-sm text-ink-soft">Publishing opens once every item above is done.</p>
        )
      ) : !canPublish ? (
        <p className="text-sm text-ink-soft">Sales or an admin publishes.</p>
      ) : null}
      {publishing.url ? (
        <p className="flex flex-wrap gap-x-4 text-sm">
          <a href={publishing.url} target="_blank" rel="noreferrer">Public page</a>
          <a href={`${publishing.url}/card`} target="_blank" rel="noreferrer">Window card</a>
        </p>
      ) : null}
      {publishing.revisions.length ? (
        <div>
          <h3 className="mb-1 text-sm font-bold">Revisions</h3>
          <ol className="flex flex-col gap-2 text-sm">
            {publishing.revisions.map((r) => (
              <li key={r.number} className="border-l-2 border-line-strong pl-2">
                <span className="font-bold">Revision {r.number}</span> <span className="text-ink-soft">· {when(r.publishedAt)} · {r.publishedByName}</span>
                {r.overrideReason ? <p className="text-brick">Published over the block: {r.overrideReason}</p> : null}
                <ul className="text-ink-soft">
                  {r.changes.map((c, i) => <li key={i}>{c}</li>)}
                </ul>
              </li>
            ))}
          </ol>
        </div>
      ) : null}
    </div>
  );
}
