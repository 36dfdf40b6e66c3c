import { useMemo, useState } from "react";
import { useSearchParams } from "react-router";
import { useVehicleContext, type VehicleContext } from "../layouts/VehicleLayout.tsx";
import { useVehicleEvidence, type VehicleEvidence } from "../../features/vehicles/api/evidence.ts";
import { useWalkaroundWrites, type DefectView } from "../../features/walkaround/api/walkaround.ts";
import { PinnablePhoto } from "../../features/walkaround/components/PinnablePhoto.tsx";
import { DefectForm, draftFrom, draftToInput, emptyDraft, type DefectDraft } from "../../features/walkaround/components/DefectForm.tsx";
import { UploadQueue } from "../../features/photos/components/UploadQueue.tsx";
import { usePhotos, useRefreshPhotos, type PhotoView } from "../../features/photos/api/photos.ts";
import { DEFECT_KIND_LABELS, REPAIR_PLAN_LABELS, SEVERITY_LABELS, ZONES, ZONE_LABELS, type Severity, type Zone } from "../../../shared/constants/evidence.ts";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";
import { can } from "../../../shared/permissions.ts";

const STATE_TEXT = { unchecked: "To check", nothing_found: "Nothing found", defects: "Defects noted" } as const;

/** The zone-by-zone pass, phone first: pick a zone, pin what you find on a photo, or mark it clear, then move on. */
export default function VehicleWalkaroundRoute() {
  const context = useVehicleContext();
  const evidence = useVehicleEvidence(context.vehicle.id);
  const photos = usePhotos(context.vehicle.id);
  if (evidence.isError) return <Notice tone="danger" title={evidence.error.message} />;
  if (photos.isError) return <Notice tone="danger" title={photos.error.message} />;
  if (evidence.isPending || photos.isPending) return <Loading label="Loading the walk-around…" />;
  return <Walkaround {...context} evidence={evidence.data} photos={photos.data.photos} />;
}

function Walkaround({ vehicle, dealership, user, evidence, photos }: VehicleContext & { evidence: VehicleEvidence; photos: PhotoView[] }) {
  const { zones, defects } = evidence;
  const [params, setParams] = useSearchParams();
  const firstUnchecked = zones.find((z) => z.state === "unchecked")?.zone ?? ZONES[0];
  const zone = (ZONES as readonly string[]).includes(params.get("zone") ?? "") ? (params.get("zone") as Zone) : firstUnchecked;
  const editable = can(user, "evidence.write");
  const writes = useWalkaroundWrites(vehicle.id);
  const refreshPhotos = useRefreshPhotos(vehicle.id);

  const zonePhotos = useMemo(() => [...photos.filter((p) => p.zone === zone), ...photos.filter((p) => p.zone !== zone)], [photos, zone]);
  const [photoId, setPhotoId] = useState<number | null>(null);
  const photo = zonePhotos.find((p) => p.id === photoId) ?? zonePhotos[0] ?? null;
  const [draft, setDraft] = useState<DefectDraft>(emptyDraft);
  const [pin, setPin] = useState<{ photoId: number; x: number; y: number } | null>(null);
  const [editing, setEditing] = useState<DefectView | null>(null);
  const [placing, setPlacing] = useState(false);
  const [message, setMessage] = useState<string | null>(null);

  // Another zone starts clean: set while rendering (React's pattern for state that follows a prop), not in an effect.
  const [formZone, setFormZone] = useState(zone);
  if (formZone !== zone) {
    setFormZone(zone);
    setPhotoId(null);
    setEditing(null);
    setPin(null);
    setDraft(emptyDraft());
    setPlacing(false);
  }

  const here = defects.filter((d) => d.zone === zone);
  const state = zones.find((z) => z.zone === zone)!;
  const go = (z: Zone) => setParams({ zone: z }, { replace: true });
  const nextZone = () => {
    const i = ZONES.indexOf(zone);
    const after = [...ZONES.slice(i + 1), ...ZONES.slice(0, i)].find((z) => zones.find((s) => s.zone === z)?.state === "unchecked");
    go(after ?? ZONES[(i + 1) % ZONES.length]);
  };

  function save(fieldsOk: boolean) {
    if (!fieldsOk) return;
    const mutation = editing ? writes.updateDefect : writes.addDefect;
    const body = editing
      ? { id: editing.id, version: editing.version, ...draftToInput(draft, zone, pin ?? editing.pin ?? null) }
      : draftToInput(draft, zone, pin);
    mutation.mutate(body as never, {
      onSuccess: (r) => {
        const d = r.defect;
        setMessage(`Defect ${d.number} ${editing ? "updated" : "recorded"}${d.pin ? " and pinned" : ""}.`);
        setDraft(emptyDraft());
        setPin(null);
        setEditing(null);
        setPlacing(false);
      },
    });
  }

  const unchecked = zones.filter((z) => z.state === "unchecked").length;
  return (
    <div className="flex flex-col gap-6 pb-24">
      <section aria-label="Zones">
        <p className="mb-2 text-sm text-ink-soft">{unchecked ? `${unchecked} of ${zones.length} zones still to check.` : "Every zone has been checked."} Left and right as seen from the driver's seat.</p>
        <ul className="grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-5">
          {zones.map((z) => (
            <li key={z.zone}>
              <button
                type="button"
                onClick={() => go(z.zone)}
                aria-current={z.zone === zone ? "true" : undefined}
                className={`flex min-h-14 w-full flex-col items-start rounded-md border px-3 py-2 text-left ${z.zone === zone ? "border-ink bg-paper-raised shadow-[inset_0_-3px_0_var(--color-signal)]" : "border-line bg-paper-raised"}`}
              >
                <span className="font-bold">{ZONE_LABELS[z.zone]}</span>
                <span className={`text-xs ${z.state === "unchecked" ? "font-bold text-ochre" : "text-ink-soft"}`}>
                  {z.state === "defects" ? `${z.defects} defect${z.defects === 1 ? "" : "s"}` : STATE_TEXT[z.state]}
                </span>
              </button>
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="zone-title" className="flex flex-col gap-4 rounded-lg border border-line bg-paper-raised p-4">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="zone-title" className="text-xl font-bold">{ZONE_LABELS[zone]}</h2>
          <span className="text-sm">{state.state === "nothing_found" ? `Checked, nothing found${state.checkedBy ? ` · ${state.checkedBy}` : ""}` : state.state === "defects" ? `${here.length} defect${here.length === 1 ? "" : "s"}` : "Not checked yet"}</span>
        </div>
        {message ? <Notice tone="success" title={message} /> : null}
        {writes.markZone.error ? <Notice tone="danger" title={writes.markZone.error.message} /> : null}

        {here.length ? (
          <ol className="flex flex-col gap-2" aria-label={`Defects in ${ZONE_LABELS[zone]}`}>
            {here.map((d) => (
              <li key={d.id} className={`flex items-start gap-3 rounded-md border p-3 ${editing?.id === d.id ? "border-signal" : "border-line"}`}>
                <span className="flex size-9 shrink-0 items-center justify-center rounded-md border-2 border-ink font-bold figures">{d.number}</span>
                <div className="min-w-0 flex-1">
                  <p className="font-bold">{SEVERITY_LABELS[d.severity]} {DEFECT_KIND_LABELS[d.kind].toLowerCase()}{d.sizeMm ? `, ${d.sizeMm} mm` : ""}{d.safetyRelevant ? " · affects safety" : ""}</p>
                  <p className="text-sm text-ink-soft">{[d.note, REPAIR_PLAN_LABELS[d.repairPlan], d.pin ? "pinned" : "not pinned"].filter(Boolean).join(" · ")}</p>
                  {editable ? (
                    <div className="mt-1 flex gap-1">
                      <button type="button" className="min-h-11 pr-3 text-sm font-bold text-signal" onClick={() => (setEditing(d), setDraft(draftFrom(d)), setPin(d.pin), d.pin && setPhotoId(d.pin.photoId))}>Edit</button>
                      <button type="button" className="min-h-11 px-3 text-sm font-bold text-brick" onClick={() => confirm(`Remove defect ${d.number}? Its number is not reused.`) && writes.removeDefect.mutate({ id: d.id, version: d.version })}>Remove</button>
                    </div>
                  ) : null}
                </div>
                {d.closeup ? <img src={d.closeup} alt={`Close-up of defect ${d.number}`} width={72} height={72} className="size-18 shrink-0 rounded-sm object-cover" /> : null}
              </li>
            ))}
          </ol>
        ) : null}

        {photos.length ? (
          <div className="flex flex-col gap-2">
            <div className="flex gap-2 overflow-x-auto pb-1" role="group" aria-label="Choose the photo to pin on">
              {zonePhotos.map((p) => (
                <button key={p.id} type="button" onClick={() => setPhotoId(p.id)} aria-pressed={photo?.id === p.id} className={`shrink-0 overflow-hidden rounded-sm border-2 ${photo?.id === p.id ? "border-signal" : "border-transparent"}`}>
                  <img src={p.thumb} alt={p.caption || `Photo ${p.position}`} width={96} height={Math.round((96 * p.height) / p.width)} className="h-16 w-auto" />
                </button>
              ))}
            </div>
            {photo ? (
              <PinnablePhoto
                photo={photo}
                defects={defects.filter((d) => d.id !== editing?.id || !pin)}
                preview={
                  pin && pin.photoId === photo.id
                    ? { number: editing?.number ?? Math.max(0, ...defects.map((d) => d.number)) + 1, severity: draft.severity as Severity, x: pin.x, y: pin.y }
                    : null
                }
                placing={placing}
                selectedId={editing?.id ?? null}
                onPlace={(x, y) => (setPin({ photoId: photo.id, x, y }), setPlacing(false))}
                onSelect={(d) => d.zone !== zone && go(d.zone)}
              />
            ) : null}
          </div>
        ) : (
          <Notice tone="info" title="No photos yet">Add photos to pin defects on them. You can still record defects without a pin.</Notice>
        )}

        {editable ? (
          <>
            <UploadQueue vehicleId={vehicle.id} onUploaded={() => void refreshPhotos()} disabled={false} />
            <DefectForm
              draft={draft}
              onChange={setDraft}
              onSubmit={save}
              busy={writes.addDefect.isPending || writes.updateDefect.isPending}
              error={editing ? writes.updateDefect.error : writes.addDefect.error}
              submitLabel={editing ? `Save defect ${editing.number}` : `Record a defect in ${ZONE_LABELS[zone].toLowerCase()}`}
              pinText={pin ? `Pinned at ${Math.round(pin.x * 100)}% across, ${Math.round(pin.y * 100)}% down the photo.` : photos.length ? "Not pinned yet: tap “Place the pin”, then tap the photo." : "No photo to pin on."}
              currency={dealership.currency}
              onCancel={editing ? () => (setEditing(null), setDraft(emptyDraft()), setPin(null)) : undefined}
            />
          </>
        ) : null}
      </section>

      {editable ? (
        <div className="fixed inset-x-0 bottom-0 z-10 border-t border-line bg-paper/95 px-3 py-2 backdrop-blur lg:left-60">
          <div className="mx-auto flex max-w-6xl gap-2">
            {photo ? (
              <button type="button" className={`min-h-12 flex-1 rounded-md border px-3 font-bold ${placing ? "border-signal bg-signal-wash" : "border-line-strong bg-paper-raised"}`} onClick={() => setPlacing(!placing)}>
                {placing ? "Tap the photo…" : "Place the pin"}
              </button>
            ) : null}
            {here.length === 0 ? (
              <button
                type="button"
                className="min-h-12 flex-1 rounded-md border border-line-strong bg-paper-raised px-3 font-bold"
                disabled={writes.markZone.isPending}
                onClick={() => writes.markZone.mutate({ zone, nothingFound: state.state !== "nothing_found" }, { onSuccess: () => state.state !== "nothing_found" && nextZone() })}
              >
                {state.state === "nothing_found" ? "Undo “nothing found”" : "Nothing found here"}
              </button>
            ) : null}
            <button type="button" className="min-h-12 flex-1 rounded-md border border-signal-strong bg-signal px-3 font-bold text-paper-raised" onClick={nextZone}>
              Next zone →
            </button>
          </div>
        </div>
      ) : null}
    </div>
  );
}
