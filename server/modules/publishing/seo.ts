import type { PublicSnapshot, PublicStatus } from "../../../shared/schemas/public.ts";
import { DEFECT_KIND_LABELS, SEVERITY_LABELS, ZONE_LABELS, type DefectKind, type Zone } from "../../../shared/constants/evidence.ts";
import { LABELS } from "../../../shared/constants/vehicle.ts";
import { formatDistance, formatMoney } from "../../../shared/domain/display.ts";

const DRIVE: Record<string, string> = {
  fwd: "https://schema.org/FrontWheelDriveConfiguration",
  rwd: "https://schema.org/RearWheelDriveConfiguration",
  awd: "https://schema.org/AllWheelDriveConfiguration",
  "4wd": "https://schema.org/FourWheelDriveConfiguration",
};
const AVAILABILITY: Record<PublicStatus, string> = {
  live: "https://schema.org/InStock",
  reserved: "https://schema.org/LimitedAvailability",
  sold: "https://schema.org/SoldOut",
};

const qv = (value: number | null | undefined, unit: { unitCode?: string; unitText?: string }, extra: Record<string, unknown> = {}) =>
  value == null ? undefined : { "@type": "QuantitativeValue", value, ...unit, ...extra };

const absolute = (base: string, path: string) => (path.startsWith("http") ? path : `${base}${path}`);

/**
 * schema.org Car with its Offer (../shared/TRADE.md §7): units as UN/CEFACT codes where schema.org has one (KMT, SMI,
 * LTR, KWT, CMQ, NU), unitText where it has none (L/100 km).
 */
export function carJsonLd(s: PublicSnapshot, status: PublicStatus, url: string, base: string) {
  const damages = s.defects.map((d) => `${d.number}. ${SEVERITY_LABELS[d.severity]} ${DEFECT_KIND_LABELS[d.kind as DefectKind].toLowerCase()}, ${ZONE_LABELS[d.zone as Zone].toLowerCase()}${d.sizeMm ? `, ${d.sizeMm} mm` : ""}${d.repairPlan === "repaired_before_sale" ? " (repaired before sale)" : ""}`);
  const data: Record<string, unknown> = {
    "@context": "https://schema.org",
    "@type": "Car",
    name: [s.title, s.variant].filter(Boolean).join(" "),
    url,
    image: s.photos.map((p) => absolute(base, p.src)),
    brand: { "@type": "Brand", name: s.make },
    model: s.model,
    vehicleConfiguration: s.variant ?? undefined,
    vehicleIdentificationNumber: s.vin ?? undefined,
    vehicleModelDate: s.buildYear ? String(s.buildYear) : undefined,
    dateVehicleFirstRegistered: s.firstRegistrationDate ?? undefined,
    bodyType: s.bodyType ? LABELS.bodyType[s.bodyType as keyof typeof LABELS.bodyType] : undefined,
    color: s.colour ?? undefined,
    numberOfDoors: s.doors ?? undefined,
    vehicleSeatingCapacity: s.seats ?? undefined,
    itemCondition: "https://schema.org/UsedCondition",
    mileageFromOdometer: qv(s.odometer.reading, { unitCode: s.odometer.unit === "mi" ? "SMI" : "KMT" }),
    fuelType: s.fuelType ? LABELS.fuelType[s.fuelType as keyof typeof LABELS.fuelType] : undefined,
    fuelCapacity: qv(s.fuelTankLitres, { unitCode: "LTR" }),
    fuelConsumption: qv(s.fuelConsumptionL100km, { unitText: "L/100 km" }, s.consumptionTestCycle ? { valueReference: LABELS.consumptionTestCycle[s.consumptionTestCycle as keyof typeof LABELS.consumptionTestCycle] } : {}),
    vehicleEngine:
      s.powerKw || s.engineCapacityCc || s.torqueNm
        ? {
            "@type": "EngineSpecification",
            enginePower: qv(s.powerKw, { unitCode: "KWT" }),
            engineDisplacement: qv(s.engineCapacityCc, { unitCode: "CMQ" }),
            torque: qv(s.torqueNm, { unitCode: "NU" }),
          }
        : undefined,
    vehicleTransmission: s.transmission ? LABELS.transmission[s.transmission as keyof typeof LABELS.transmission] : undefined,
    numberOfForwardGears: s.gears ?? undefined,
    driveWheelConfiguration: s.driveType ? DRIVE[s.driveType] : undefined,
    // Our count excludes the dealership itself (schema.org leaves who counts to the publisher).
    numberOfPreviousOwners: s.previousOwners ?? undefined,
    knownVehicleDamages: damages.length ? damages.join("; ") : "None noted at inspection.",
    offers: {
      "@type": "Offer",
      price: s.priceCents != null ? s.priceCents / 100 : undefined,
      priceCurrency: s.currency,
      availability: AVAILABILITY[status],
      itemCondition: "https://schema.org/UsedCondition",
      url,
      seller: {
        "@type": "AutoDealer",
        name: s.dealership.name,
        telephone: s.dealership.phone || undefined,
        address: { "@type": "PostalAddress", streetAddress: s.dealership.addressLine, addressLocality: s.dealership.town, addressRegion: s.dealership.region, postalCode: s.dealership.postcode, addressCountry: s.dealership.country },
      },
    },
  };
  return JSON.parse(JSON.stringify(data)) as Record<string, unknown>;
}

const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

export function describeForPreview(s: PublicSnapshot) {
  const bits = [
    s.priceCents != null ? formatMoney(s.priceCents, s.currency, s.dealership.locale) : null,
    s.odometer.km != null ? formatDistance(s.odometer.km, s.odometer.unit) : null,
    s.condition.index != null ? `condition index ${Math.round(s.condition.index)}/100` : null,
    s.condition.sentence,
  ].filter(Boolean);
  return `${bits.join(" · ")} Photos, every defect pinned, tyres and checks, at ${s.dealership.name}, ${s.dealership.town}.`;
}

/** The head tags the server writes into the page for this vehicle: title, description, canonical, Open Graph, Twitter, JSON-LD. */
export function vehicleHeadTags(s: PublicSnapshot, status: PublicStatus, url: string, base: string): string {
  const title = `${[s.title, s.variant].filter(Boolean).join(" ")}${status === "sold" ? " (sold)" : ""} · ${s.dealership.name}`;
  const description = describeForPreview(s);
  const cover = s.photos.find((p) => p.isCover) ?? s.photos[0];
  const image = cover ? absolute(base, cover.srcsetJpeg.split(", ").find((x) => x.endsWith(" 1024w"))?.split(" ")[0] ?? cover.src) : null;
  const json = JSON.stringify(carJsonLd(s, status, url, base)).replace(/</g, "\\u003c");
  return [
    `<title>${esc(title)}</title>`,
    `<meta name="description" content="${esc(description)}" />`,
    `<link rel="canonical" href="${esc(url)}" />`,
    `<meta property="og:type" content="product" />`,
    `<meta property="og:title" content="${esc(title)}" />`,
    `<meta property="og:description" content="${esc(description)}" />`,
    `<meta property="og:url" content="${esc(url)}" />`,
    `<meta property="og:site_name" content="${esc(s.dealership.name)}" />`,
    image ? `<meta property="og:image" content="${esc(image)}" />` : "",
    `<meta name="twitter:card" content="${image ? "summary_large_image" : "summary"}" />`,
    `<meta name="twitter:title" content="${esc(title)}" />`,
    `<meta name="twitter:description" content="${esc(description)}" />`,
    image ? `<meta name="twitter:image" content="${esc(image)}" />` : "",
    `<script type="application/ld+json">${json}</script>`,
  ]
    .filter(Boolean)
    .join("\n    ");
}
