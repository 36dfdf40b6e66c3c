import type { Photo } from "../../db/schema/index.ts";

export const mediaUrl = (key: string) => `/media/${key}`;

/** Only finished photos are shown to buyers: a revision must never point at sizes still being made. */
export const shownPublicly = (p: Pick<Photo, "status">) => p.status === "ready";

const bySizeOf = (p: Photo) => [...p.variants].sort((a, b) => a.width - b.width);

/** The file behind `src`: the JPEG size nearest 1000 px wide, or the master while no JPEG size exists yet. */
function fallbackKeyOf(p: Photo, bySize = bySizeOf(p)) {
  const jpegs = bySize.filter((v) => v.format === "jpeg");
  return (jpegs.find((v) => v.width >= 1000) ?? jpegs.at(-1))?.key ?? p.masterKey;
}

/** The storage keys of every file a presented photo points at in `src` and its srcsets (what a revision must keep). */
export const servedKeysOf = (p: Photo) => [...new Set([fallbackKeyOf(p), ...p.variants.map((v) => v.key)])];

/** A photo as the pages use it: a fallback src, srcsets per format, its size and placeholder. */
export function presentPhoto(p: Photo) {
  const bySize = bySizeOf(p);
  const srcset = (format: string) =>
    bySize
      .filter((v) => v.format === format)
      .map((v) => `${mediaUrl(v.key)} ${v.width}w`)
      .join(", ");
  return {
    id: p.id,
    status: p.status,
    position: p.position,
    isCover: p.isCover,
    caption: p.caption,
    zone: p.zone,
    width: p.width,
    height: p.height,
    placeholder: p.placeholder,
    src: mediaUrl(fallbackKeyOf(p, bySize)),
    srcsetAvif: srcset("avif"),
    srcsetWebp: srcset("webp"),
    srcsetJpeg: srcset("jpeg"),
    thumb: mediaUrl(bySize.find((v) => v.format === "webp")?.key ?? p.masterKey),
    version: p.version,
  };
}
export type PhotoView = ReturnType<typeof presentPhoto>;

/** A file the upload could not use, with the reason in words. */
export interface Refusal {
  name: string;
  status: number;
  code: string;
  reason: string;
}

/** POST /api/vehicles/:id/photos (201): the photos stored and the files refused, one by one. */
export const presentUpload = (accepted: PhotoView[], refused: Refusal[]) => ({ photos: accepted, refused });
export type UploadResult = ReturnType<typeof presentUpload>;
