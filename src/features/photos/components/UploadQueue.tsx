import { useRef, useState } from "react";
import { uploadPhoto } from "../api/photos.ts";
import { PHOTO_LIMITS } from "../../../../shared/constants/evidence.ts";

type ItemState = "waiting" | "uploading" | "done" | "refused" | "failed";
interface Item {
  id: number;
  file: File;
  state: ItemState;
  progress: number;
  message: string;
}

const mb = (bytes: number) => `${Math.round(bytes / 1024 / 1024)} MB`;
export const LIMITS_TEXT = `Up to ${PHOTO_LIMITS.maxFilesPerUpload} photos at a time, ${mb(PHOTO_LIMITS.maxFileBytes)} each, ${PHOTO_LIMITS.maxPhotosPerVehicle} per vehicle, at most ${PHOTO_LIMITS.maxInputPixels / 1e6} megapixels. JPEG, PNG, WebP or AVIF. Location data and other metadata are removed.`;

let nextId = 1;

/**
 * Sends each chosen photo on its own, two at a time, with a progress bar per file. A refused file says why; a file
 * that failed on the way can be retried without sending the others again.
 */
export function UploadQueue({ vehicleId, onUploaded, disabled }: { vehicleId: number; onUploaded: () => void; disabled: boolean }) {
  const [items, setItems] = useState<Item[]>([]);
  const fileInput = useRef<HTMLInputElement>(null);
  const cameraInput = useRef<HTMLInputElement>(null);
  const active = useRef(0);
  const queue = useRef<Item[]>([]);

  const patchItem = (id: number, change: Partial<Item>) => setItems((list) => list.map((i) => (i.id === id ? { ...i, ...change } : i)));

  const pump = () => {
    while (active.current < 2 && queue.current.length) {
      const item = queue.current.shift()!;
      active.current++;
      patchItem(item.id, { state: "uploading", progress: 0, message: "" });
      uploadPhoto(vehicleId, item.file, (f) => patchItem(item.id, { progress: f }))
        .then((r) => {
          if (r.refused?.length) patchItem(item.id, { state: "refused", message: r.refused[0].reason });
          else patchItem(item.id, { state: "done", progress: 1 });
          onUploaded();
        })
        .catch((e: { status?: number; message: string }) => patchItem(item.id, { state: e.status && e.status >= 400 && e.status < 500 ? "refused" : "failed", message: e.message }))
        .finally(() => {
          active.current--;
          pump();
        });
    }
  };

  function add(files: FileList | null) {
    if (!files?.length) return;
    const fresh = [...files].map((file): Item => {
      const tooBig = file.size > PHOTO_LIMITS.maxFileBytes;
      return { id: nextId++, file, state: tooBig ? "refused" : "waiting", progress: 0, message: tooBig ? `This file is ${mb(file.size)}; the limit is ${mb(PHOTO_LIMITS.maxFileBytes)}.` : "" };
    });
    setItems((list) => [...list.filter((i) => i.state !== "done"), ...fresh]);
    queue.current.push(...fresh.filter((i) => i.state === "waiting"));
    pump();
  }

  function retry(item: Item) {
    patchItem(item.id, { state: "waiting", message: "" });
    queue.current.push(item);
    pump();
  }

  const label = { waiting: "Waiting", uploading: "Uploading", done: "Uploaded", refused: "Refused", failed: "Failed" } as const;
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap gap-2">
        {/* The inputs are worked by the two buttons below; hidden from assistive technology so each control is announced once. */}
        <input ref={cameraInput} type="file" accept="image/*" capture="environment" className="sr-only" tabIndex={-1} aria-hidden onChange={(e) => (add(e.target.files), (e.target.value = ""))} aria-label="Take a photo" />
        <input ref={fileInput} type="file" accept="image/*" multiple className="sr-only" tabIndex={-1} aria-hidden onChange={(e) => (add(e.target.files), (e.target.value = ""))} aria-label="Choose photos" data-testid="photo-input" />
        <button type="button" disabled={disabled} className="min-h-12 flex-1 rounded-md border border-signal-strong bg-signal px-4 font-bold text-paper-raised sm:flex-none" onClick={() => cameraInput.current?.click()}>
          Take a photo
        </button>
        <button type="button" disabled={disabled} className="min-h-12 flex-1 rounded-md border border-line-strong bg-paper-raised px-4 font-bold sm:flex-none" onClick={() => fileInput.current?.click()}>
          Choose photos
        </button>
      </div>
      <p className="text-xs text-ink-soft">{LIMITS_TEXT}</p>
      {items.length ? (
        <ul className="flex flex-col gap-2" aria-label="Uploads" aria-live="polite">
          {items.map((i) => (
            <li key={i.id} className="rounded-md border border-line bg-paper-raised px-3 py-2 text-sm" data-state={i.state}>
              <div className="flex items-center justify-between gap-2">
                <span className="truncate font-bold">{i.file.name}</span>
                <span className={i.state === "refused" || i.state === "failed" ? "font-bold text-brick" : "text-ink-soft"}>{label[i.state]}{i.state === "uploading" ? ` ${Math.round(i.progress * 100)}%` : ""}</span>
              </div>
              {i.state === "uploading" || i.state === "waiting" ? (
                <progress className="mt-1 h-2 w-full accent-signal" max={1} value={i.progress} aria-label={`Upload of ${i.file.name}`} />
              ) : null}
              {i.message ? <p className="mt-1">{i.message}</p> : null}
              {i.state === "failed" ? (
                <button type="button" className="mt-1 min-h-11 font-bold text-signal" onClick={() => retry(i)}>Retry this photo</button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
