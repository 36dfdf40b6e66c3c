// What a vehicle still lacks before it may be published (../shared/PRODUCT.md "readiness"). Pure: the server
// computes it on every read and refuses a publish that is not ready; the staff screen lists it with links.

export interface ReadinessInput {
  vin: { present: boolean; structurallyValid: boolean; checkDigitBlocking: boolean };
  priceCents: number | null;
  description: string | null;
  photos: { count: number; processing: number; hasCover: boolean };
  minPhotos: number;
  zones: Array<{ zone: string; state: "unchecked" | "nothing_found" | "defects" }>;
  roadTyresMeasured: number;
  blockingCautions: Array<{ code: string; text: string }>;
  /** Numbers of the defects that affect safety and are not repaired before sale. */
  unrepairedSafetyDefects: number[];
}

export type ReadinessSection = "record" | "photos" | "walkaround" | "checks";

export interface ReadinessItem {
  code: string;
  ok: boolean;
  label: string;
  detail: string;
  section: ReadinessSection;
}

export interface Readiness {
  ready: boolean;
  items: ReadinessItem[];
  missing: ReadinessItem[];
}

export function readiness(input: ReadinessInput): Readiness {
  const unchecked = input.zones.filter((z) => z.state === "unchecked").length;
  const items: ReadinessItem[] = [
    {
      code: "vin",
      ok: input.vin.present && input.vin.structurallyValid && !input.vin.checkDigitBlocking,
      label: "A valid VIN",
      detail: !input.vin.present ? "Enter the VIN from the compliance plate." : input.vin.structurallyValid && !input.vin.checkDigitBlocking ? "The VIN passes its checks." : "The VIN does not pass its checks; read it again from the plate.",
      section: "record",
    },
    { code: "price", ok: input.priceCents != null && input.priceCents > 0, label: "A price", detail: input.priceCents ? "Price set." : "Set the advertised price.", section: "record" },
    {
      code: "description",
      ok: Boolean(input.description && input.description.trim().length >= 20),
      label: "Listing copy",
      detail: input.description?.trim() ? (input.description.trim().length >= 20 ? "Copy written." : "Write a little more: at least a sentence or two.") : "Write the listing copy.",
      section: "record",
    },
    {
      code: "photos",
      ok: input.photos.count >= input.minPhotos && input.photos.hasCover,
      label: `At least ${input.minPhotos} photos with a cover`,
      detail: `${input.photos.count} of ${input.minPhotos} photos${input.photos.hasCover ? "" : ", and no cover chosen"}.`,
      section: "photos",
    },
    {
      code: "photos_processing",
      ok: input.photos.processing === 0,
      label: "Photos processed",
      detail: input.photos.processing ? `${input.photos.processing} photo${input.photos.processing === 1 ? " is" : "s are"} still being prepared; this takes a minute.` : "Every photo is ready to show.",
      section: "photos",
    },
    {
      code: "walkaround",
      ok: unchecked === 0,
      label: "Every zone of the walk-around checked",
      detail: unchecked ? `${unchecked} zone${unchecked === 1 ? "" : "s"} still to check.` : "Every zone checked.",
      section: "walkaround",
    },
    {
      code: "tyres",
      ok: input.roadTyresMeasured >= 4,
      label: "Four tyres measured",
      detail: `${input.roadTyresMeasured} of 4 road tyres measured.`,
      section: "checks",
    },
    {
      code: "safety",
      ok: input.blockingCautions.length === 0,
      label: "No failed safety item",
      detail: input.blockingCautions.length ? input.blockingCautions.map((c) => c.text).join(" ") : "No safety item failed.",
      section: "checks",
    },
    {
      code: "safety_defects",
      ok: input.unrepairedSafetyDefects.length === 0,
      label: "No unrepaired defect that affects safety",
      detail: safetyDefectsDetail(input.unrepairedSafetyDefects),
      section: "walkaround",
    },
  ];
  const missing = items.filter((i) => !i.ok);
  return { ready: missing.length === 0, items, missing };
}

function safetyDefectsDetail(numbers: number[]): string {
  if (numbers.length === 0) return "No defect that affects safety is waiting for repair.";
  const one = numbers.length === 1;
  const list = one ? `Item ${numbers[0]}` : `Items ${numbers.slice(0, -1).join(", ")} and ${numbers.at(-1)}`;
  return `${list} ${one ? "affects" : "affect"} safety and ${one ? "is" : "are"} not repaired. Repair ${one ? "it" : "them"} and set the plan to "Repaired before sale", or an admin may publish over this with a written reason.`;
}
