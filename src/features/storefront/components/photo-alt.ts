import type { PublicPhoto } from "../../../../shared/schemas/public.ts";

/** Alt text from what staff wrote, else the zone, else the place in the set. */
export function photoAlt(photo: PublicPhoto, index: number, total: number, zoneName: (zone: string) => string): string {
  const what = photo.caption.trim() || (photo.zone ? `${zoneName(photo.zone)} of the vehicle` : "The vehicle");
  return total > 1 ? `${what} (photo ${index + 1} of ${total})` : what;
}
