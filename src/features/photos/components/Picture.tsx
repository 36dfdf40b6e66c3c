import { useState } from "react";
import type { PhotoView } from "../api/photos.ts";

/**
 * A responsive photo: AVIF, then WebP, then JPEG, with its width and height set so nothing shifts, and the tiny
 * placeholder shown until the real image arrives.
 */
export function Picture({ photo, alt, sizes = "(min-width: 1024px) 33vw, 100vw", eager = false, className = "" }: { photo: PhotoView; alt: string; sizes?: string; eager?: boolean; className?: string }) {
  const [loaded, setLoaded] = useState(false);
  return (
    // A new element when the variants arrive (processing → ready), rather than swapping sources under a loaded image.
    <picture key={photo.srcsetAvif || photo.src}>
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
        decoding="async"
        onLoad={() => setLoaded(true)}
        style={loaded ? undefined : { backgroundImage: `url(${photo.placeholder})`, backgroundSize: "cover" }}
        className={`block h-auto w-full bg-paper-sunk ${className}`}
      />
    </picture>
  );
}
