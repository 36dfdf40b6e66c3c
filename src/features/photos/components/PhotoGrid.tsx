import { useState, type DragEvent, type KeyboardEvent } from "react";
import { useDeletePhoto, useReorderPhotos, useUpdatePhoto, type PhotoView } from "../api/photos.ts";
import { ZONES, ZONE_LABELS } from "../../../../shared/constants/evidence.ts";
import { Picture } from "../../../components/ui/Picture.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";

/** Arrange the photos: drag to reorder or use the move buttons (and Alt+arrow keys), choose the cover, caption, zone, delete. */
export function PhotoGrid({ vehicleId, photos, editable }: { vehicleId: number; photos: PhotoView[]; editable: boolean }) {
  const reorder = useReorderPhotos(vehicleId);
  const update = useUpdatePhoto(vehicleId);
  const remove = useDeletePhoto(vehicleId);
  const [dragging, setDragging] = useState<number | null>(null);
  const [captions, setCaptions] = useState<Record<number, string>>({});
  const error = reorder.error ?? update.error ?? remove.error;

  const move = (from: number, to: number) => {
    if (to < 0 || to >= photos.length || from === to) return;
    const ids = photos.map((p) => p.id);
    const [id] = ids.splice(from, 1);
    ids.splice(to, 0, id);
    reorder.mutate(ids);
  };

  const onDrop = (e: DragEvent, index: number) => {
    e.preventDefault();
    const from = photos.findIndex((p) => p.id === dragging);
    setDragging(null);
    if (from >= 0) move(from, index);
  };

  const onKey = (e: KeyboardEvent, index: number) => {
    if (!e.altKey) return;
    const step = e.key === "ArrowLeft" || e.key === "ArrowUp" ? -1 : e.key === "ArrowRight" || e.key === "ArrowDown" ? 1 : 0;
    if (!step) return;
    e.preventDefault();
    move(index, index + step);
  };

  return (
    <div className="flex flex-col gap-3">
      {error ? <Notice tone="danger" title={error.message} /> : null}
      <ol className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3" aria-label="Photos in display order">
        {photos.map((p, i) => (
          <li
            key={p.id}
            draggable={editable}
            onDragStart={() => setDragging(p.id)}
            onDragOver={(e) => editable && e.preventDefault()}
            onDrop={(e) => onDrop(e, i)}
            onKeyDown={(e) => onKey(e, i)}
            className={`flex flex-col overflow-hidden rounded-lg border bg-paper-raised ${dragging === p.id ? "border-signal opacity-60" : "border-line"}`}
            data-testid="photo-card"
          >
            <div className="relative">
              <Picture photo={p} alt={p.caption || `Photo ${i + 1}`} sizes="(min-width: 1280px) 30vw, (min-width: 640px) 45vw, 100vw" eager={i < 2} />
              <span className="absolute left-2 top-2 rounded-sm bg-ink/80 px-2 py-0.5 text-xs font-bold text-paper figures">{i + 1}</span>
              {p.isCover ? <span className="absolute right-2 top-2 rounded-sm bg-signal px-2 py-0.5 text-xs font-bold text-paper-raised">Cover</span> : null}
              {p.status !== "ready" ? (
                <span className="absolute bottom-2 left-2 rounded-sm bg-paper-raised/90 px-2 py-0.5 text-xs font-bold">{p.status === "processing" ? "Processing sizes…" : "Processing failed"}</span>
              ) : null}
            </div>
            {editable ? (
              <div className="flex flex-col gap-2 p-3">
                <label className="text-xs font-bold">
                  Caption
                  <input
                    className="mt-1 min-h-11 w-full rounded-md border border-line-strong px-2 font-normal"
                    value={captions[p.id] ?? p.caption}
                    maxLength={200}
                    onChange={(e) => setCaptions({ ...captions, [p.id]: e.target.value })}
                    onBlur={() => {
                      const caption = captions[p.id];
                      if (caption !== undefined && caption !== p.caption) update.mutate({ id: p.id, version: p.version, caption });
                    }}
                  />
                </label>
                <label className="text-xs font-bold">
                  Zone
                  <select className="mt-1 min-h-11 w-full rounded-md border border-line-strong px-2 font-normal" value={p.zone ?? ""} onChange={(e) => update.mutate({ id: p.id, version: p.version, zone: e.target.value || null })}>
                    <option value="">No zone</option>
                    {ZONES.map((z) => <option key={z} value={z}>{ZONE_LABELS[z]}</option>)}
                  </select>
                </label>
                <div className="flex flex-wrap gap-1">
                  <button type="button" className="min-h-11 rounded-md border border-line-strong px-3 text-sm font-bold disabled:opacity-40" disabled={i === 0} onClick={() => move(i, i - 1)} aria-label={`Move photo ${i + 1} earlier`}>← Earlier</button>
                  <button type="button" className="min-h-11 rounded-md border border-line-strong px-3 text-sm font-bold disabled:opacity-40" disabled={i === photos.length - 1} onClick={() => move(i, i + 1)} aria-label={`Move photo ${i + 1} later`}>Later →</button>
                  {!p.isCover ? <button type="button" className="min-h-11 rounded-md px-3 text-sm font-bold text-signal" onClick={() => update.mutate({ id: p.id, version: p.version, isCover: true })}>Make cover</button> : null}
                  <button
                    type="button"
                    className="ml-auto min-h-11 rounded-md px-3 text-sm font-bold text-brick"
                    onClick={() => confirm(`Delete photo ${i + 1}? Pins on it are removed from their defects; the defects stay.`) && remove.mutate({ id: p.id, version: p.version })}
                  >
                    Delete
                  </button>
                </div>
              </div>
            ) : p.caption ? (
              <p className="p-3 text-sm">{p.caption}</p>
            ) : null}
          </li>
        ))}
      </ol>
      {editable && photos.length > 1 ? <p className="text-xs text-ink-soft">Drag a photo to reorder, or focus one and press Alt with an arrow key. The first photo leads the gallery.</p> : null}
    </div>
  );
}
