import { useState } from "react";
import type { PublicPhoto } from "../../../../shared/schemas/public.ts";

/**
 * A published photo: AVIF, then WebP, then JPEG, each a srcset of widths; width and height set so the page never
 * shifts; the tiny placeholder painted until the real image arrives. Lazy unless `eager` (only the first image of a
 * page is). With `fill` the image covers or fits the box its parent sets (the parent fixes the aspect ratio).
 */
export function PublicPicture({
  photo,
  alt,
  sizes = "100vw",
  eager = false,
  highPriority = false,
  fill,
  className = "",
}: {
  photo: PublicPhoto;
  alt: string;
  sizes?: string;
  eager?: boolean;
  highPriority?: boolean;
  fill?: "cover" | "contain";
  className?: string;
}) {
  const [loaded, setLoaded] = useState(false);
  const fit = fill === "cover" ? "h-full w-full object-cover" : fill === "contain" ? "h-full w-full object-contain" : "h-auto w-full";
  return (
    <picture className={fill ? "block h-full w-full" : "block"}>
      {photo.srcsetAvif ? <source type="image/avif" srcSet={photo.srcsetAvif} sizes={sizes} /> : null}
      {photo.srcsetWebp ? <source type="image/webp" srcSet={photo.srcsetWebp} sizes={sizes} /> : null}
      <img
        src={photo.src}
        srcSet={photo.srcsetJpeg || undefined}
        sizes={sizes}
        width={photo.width}
        height={photo.height}
        alt={alt}
        loading={eager ? "eager" : "lazy"}
        fetchPriority={highPriority ? "high" : undefined}
        decoding="async"
        // The placeholder stays until the photo is decoded, so there is never a blank moment between the two.
        onLoad={(e) => {
          e.currentTarget
            .decode()
            .catch(() => undefined)
            .finally(() => setLoaded(true));
        }}
        style={loaded || !photo.placeholder ? undefined : { backgroundImage: `url("${photo.placeholder}")`, backgroundSize: "cover", backgroundPosition: "center" }}
        className={`block ${fit} bg-paper-sunk ${className}`}
      />
    </picture>
  );
}

/** Alt text from what staff wrote, else the zone, else the place in the set. */
export function photoAlt(photo: PublicPhoto, index: number, total: number, zoneName: (zone: string) => string): string {
  const what = photo.caption.trim() || (photo.zone ? `${zoneName(photo.zone)} of the vehicle` : "The vehicle");
  return total > 1 ? `${what} (photo ${index + 1} of ${total})` : what;
}
