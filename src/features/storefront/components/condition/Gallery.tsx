import { useEffect, useId, useRef, useState, type KeyboardEvent, type PointerEvent } from "react";
import type { PublicPhoto } from "../../../../../shared/schemas/public.ts";
import { formatNumber } from "../../../../../shared/domain/display.ts";
import { zoneLabel } from "../../format.ts";
import { photoAlt } from "../photo-alt.ts";
import { Picture } from "../../../../components/ui/Picture.tsx";

/**
 * The photos: one large, the rest as a strip of thumbnails. The stage keeps the cover's proportions whatever photo
 * it shows, so nothing below it moves. Left and right arrow keys (on the stage or the strip) move between photos,
 * Home and End jump to the ends; a swipe does the same on a phone. Only the cover loads eagerly.
 */
export function Gallery({ photos, title, locale }: { photos: PublicPhoto[]; title: string; locale: string }) {
  const coverIndex = Math.max(0, photos.findIndex((p) => p.isCover));
  const [index, setIndex] = useState(coverIndex);
  const thumbs = useRef<Array<HTMLButtonElement | null>>([]);
  const thumbsLabel = useId();
  const swipe = useRef<{ x: number; y: number } | null>(null);

  // A printed report shows the cover, whichever photo was last looked at.
  useEffect(() => {
    const reset = () => setIndex(coverIndex);
    window.addEventListener("beforeprint", reset);
    return () => window.removeEventListener("beforeprint", reset);
  }, [coverIndex]);

  if (photos.length === 0) {
    return (
      <div className="flex aspect-[3/2] items-center justify-center rounded-lg border border-dashed border-line-strong bg-paper-raised p-6 text-center text-ink-soft">
        No photos were published with this report. Ask us for them, or come and see the vehicle.
      </div>
    );
  }

  const total = photos.length;
  const cover = photos[coverIndex];
  const photo = photos[index];
  const alt = (i: number) => photoAlt(photos[i], i, total, zoneLabel);
  const go = (i: number, focusThumb = false) => {
    const next = (i + total) % total;
    setIndex(next);
    const t = thumbs.current[next];
    t?.scrollIntoView({ block: "nearest", inline: "nearest" });
    if (focusThumb) t?.focus();
  };
  const keys = (e: KeyboardEvent, focusThumb: boolean) => {
    const to = { ArrowRight: index + 1, ArrowLeft: index - 1, Home: 0, End: total - 1 }[e.key];
    if (to === undefined) return;
    e.preventDefault();
    go(to, focusThumb);
  };
  const down = (e: PointerEvent) => {
    if (e.pointerType !== "mouse") swipe.current = { x: e.clientX, y: e.clientY };
  };
  const up = (e: PointerEvent) => {
    const s = swipe.current;
    swipe.current = null;
    if (!s) return;
    const dx = e.clientX - s.x;
    if (Math.abs(dx) > 40 && Math.abs(dx) > Math.abs(e.clientY - s.y)) go(index + (dx < 0 ? 1 : -1));
  };
  const caption = photo.caption.trim() || (photo.zone ? zoneLabel(photo.zone) : "");
  const arrow = "fr-gallery-control absolute top-1/2 flex size-11 -translate-y-1/2 items-center justify-center rounded-md border border-line-strong bg-paper-raised/95 text-xl font-bold text-ink hover:border-ink print:hidden";

  return (
    <section aria-label={`Photos of the ${title}`} className="fr-gallery">
      <figure>
        <div
          role="group"
          aria-roledescription="photo viewer"
          aria-label={`Photo ${index + 1} of ${total}. Use the left and right arrow keys to move between photos.`}
          tabIndex={0}
          onKeyDown={(e) => keys(e, false)}
          onPointerDown={down}
          onPointerUp={up}
          onPointerCancel={() => (swipe.current = null)}
          className="fr-stage relative touch-pan-y overflow-hidden rounded-lg border border-line bg-paper-sunk"
          style={{ aspectRatio: `${cover.width} / ${cover.height}` }}
        >
          <Picture
            key={index}
            photo={photo}
            alt={alt(index)}
            sizes="(min-width: 1024px) 56vw, 100vw"
            eager={index === coverIndex}
            highPriority={index === coverIndex}
            fill="contain"
          />
          {total > 1 ? (
            <>
              <button type="button" className={`${arrow} left-2`} onClick={() => go(index - 1)} aria-label="Previous photo">
                <span aria-hidden>←</span>
              </button>
              <button type="button" className={`${arrow} right-2`} onClick={() => go(index + 1)} aria-label="Next photo">
                <span aria-hidden>→</span>
              </button>
            </>
          ) : null}
        </div>
        <figcaption className="mt-2 flex items-baseline justify-between gap-3 text-sm print:hidden" aria-live="polite">
          <span className="min-w-0">{caption}</span>
          {total > 1 ? (
            <span className="shrink-0 text-ink-soft figures print:hidden">
              {formatNumber(index + 1, { locale })} of {formatNumber(total, { locale })}
            </span>
          ) : null}
        </figcaption>
      </figure>
      {/* The thumbnails' list is named by text it points to: aria-label on an element without a role is flagged by validators. */}
      <span id={thumbsLabel} hidden>
        All photos
      </span>
      {total > 1 ? (
        <ul aria-labelledby={thumbsLabel} className="fr-gallery-control mt-3 flex gap-2 overflow-x-auto pb-2 print:hidden" onKeyDown={(e) => keys(e, true)}>
          {photos.map((p, i) => (
            <li key={i} className="shrink-0">
              <button
                type="button"
                ref={(el) => {
                  thumbs.current[i] = el;
                }}
                onClick={() => go(i)}
                aria-current={i === index ? "true" : undefined}
                tabIndex={i === index ? 0 : -1}
                aria-label={`Show ${alt(i)}`}
                className={`block w-20 overflow-hidden rounded-md border-2 sm:w-24 ${i === index ? "border-ink" : "border-transparent opacity-85 hover:opacity-100"}`}
              >
                <span className="block aspect-[4/3]">
                  <Picture photo={p} alt="" sizes="96px" fill="cover" />
                </span>
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
