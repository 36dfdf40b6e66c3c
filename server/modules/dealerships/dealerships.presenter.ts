import type { Dealership } from "../../db/schema/index.ts";
import type { PublicDealership } from "../../../shared/schemas/dealership.ts";

/** GET/PATCH /api/dealership (inside `{ dealership }`): every setting, for staff. */
export function presentDealership(d: Dealership) {
  const { createdAt, updatedAt, ...rest } = d;
  return { ...rest, createdAt: createdAt.toISOString(), updatedAt: updatedAt.toISOString() };
}
export type DealershipView = ReturnType<typeof presentDealership>;

/** What buyers may see of the dealership: its name, address and how to reach it; never the stock counter. */
export function presentPublicDealership(d: Dealership): PublicDealership {
  return {
    name: d.name,
    slug: d.slug,
    addressLine: d.addressLine,
    town: d.town,
    region: d.region,
    postcode: d.postcode,
    country: d.country,
    licenceNumber: d.licenceNumber,
    phone: d.phone,
    email: d.email,
    website: d.website,
    locale: d.locale,
    currency: d.currency,
    distanceUnit: d.distanceUnit,
    timeZone: d.timeZone,
  };
}
