import type { MouseEvent } from "react";
import type { PhotoView } from "../../photos/api/photos.ts";
import { Picture } from "../../../components/ui/Picture.tsx";
import type { DefectView } from "../api/walkaround.ts";
import { DefectPin } from "./DefectPin.tsx";
import { DEFECT_KIND_LABELS, SEVERITY_LABELS, type Severity } from "../../../../shared/constants/evidence.ts";

/** A photo with its numbered pins. In placing mode a tap records the point as fractions of the image. */
export function PinnablePhoto({
  photo, defects, placing, onPlace, onSelect, selectedId, preview,
}: {
  photo: PhotoView;
  defects: DefectView[];
  placing: boolean;
  onPlace?: (x: number, y: number) => void;
  onSelect?: (d: DefectView) => void;
  selectedId?: number | null;
  /** The pin being placed, before it is saved. */
  preview?: { number: number; severity: Severity; x: number; y: number } | null;
}) {
  const pins = defects.filter((d) => d.pin?.photoId === photo.id);
  const click = (e: MouseEvent<HTMLDivElement>) => {
    if (!placing || !onPlace) return;
    const box = e.currentTarget.getBoundingClientRect();
    const x = Math.min(1, Math.max(0, (e.clientX - box.left) / box.width));
    const y = Math.min(1, Math.max(0, (e.clientY - box.top) / box.height));
    onPlace(Math.round(x * 10000) / 10000, Math.round(y * 10000) / 10000);
  };
  return (
    <div
      className={`relative overflow-hidden rounded-md border ${placing ? "cursor-crosshair border-signal ring-3 ring-signal/40" : "border-line"}`}
      onClick={click}
      data-testid="pinnable-photo"
    >
      <Picture photo={photo} alt={photo.caption || "Vehicle photo"} sizes="(min-width: 1024px) 50vw, 100vw" eager />
      {pins.map((d) => (
        <DefectPin
          key={d.id}
          number={d.number}
          severity={d.severity}
          x={d.pin!.x}
          y={d.pin!.y}
          selected={selectedId === d.id}
          label={`${SEVERITY_LABELS[d.severity].toLowerCase()} ${DEFECT_KIND_LABELS[d.kind].toLowerCase()}`}
          onClick={() => onSelect?.(d)}
        />
      ))}
      {preview ? <DefectPin number={preview.number} severity={preview.severity} x={preview.x} y={preview.y} selected label="not saved yet" /> : null}
      {placing ? <p className="pointer-events-none absolute inset-x-0 bottom-0 bg-ink/80 px-3 py-2 text-center text-sm font-bold text-paper">Tap the exact spot of the defect</p> : null}
    </div>
  );
}
