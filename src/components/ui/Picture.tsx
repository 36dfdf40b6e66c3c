import { useState } from "react";
import type { PublicPhoto } from "../../../shared/schemas/public.ts";

/** What a picture needs: a served photo, public (a revision) or staff (a photo being worked on). */
export type PictureSource = Pick<PublicPhoto, "src" | "srcsetAvif" | "srcsetWebp" | "srcsetJpeg" | "width" | "height" | "placeholder">;

/**
 * A photo: AVIF, then WebP, then JPEG, each a srcset of widths; width and height set so the page never
 * shifts; the tiny placeholder painted until the real image arrives. Lazy unless `eager` (only the first image of a
 * page is). With `fill` the image covers or fits the box its parent sets (the parent fixes the aspect ratio).
 */
export function Picture({
  photo,
  alt,
  sizes = "100vw",
  eager = false,
  highPriority = false,
  fill,
  className = "",
}: {
  photo: PictureSource;
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
    // A new element when the sizes arrive (processing → ready), rather than swapping sources under a loaded image.
    <picture key={photo.srcsetAvif || photo.src} className={fill ? "block h-full w-full" : "block"}>
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

