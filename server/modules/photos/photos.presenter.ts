import type { Photo } from "../../db/schema/index.ts";

export const mediaUrl = (key: string) => `/media/${key}`;

/** A photo as the pages use it: a fallback src, srcsets per format, its size and placeholder. */
export function presentPhoto(p: Photo) {
  const bySize = [...p.variants].sort((a, b) => a.width - b.width);
  const srcset = (format: string) =>
    bySize
      .filter((v) => v.format === format)
      .map((v) => `${mediaUrl(v.key)} ${v.width}w`)
      .join(", ");
  const jpegs = bySize.filter((v) => v.format === "jpeg");
  const fallback = jpegs.find((v) => v.width >= 1000) ?? jpegs[jpegs.length - 1];
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
    src: fallback ? mediaUrl(fallback.key) : mediaUrl(p.masterKey),
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
