// The storefront's view lives in the URL: every filter, the sort and the page are search parameters, so a link
// reproduces the view and the back button walks through earlier ones. Prices in the URL are whole currency units
// and the odometer limit is in the dealership's own distance unit; the API takes minor units and km.
import { BODY_TYPES, FUEL_TYPES } from "../../../../shared/constants/vehicle.ts";
import { milesToKm } from "../../../../shared/domain/units.ts";
import type { PublicListQuery, PublicSort } from "../../../../shared/schemas/public-query.ts";
import type { PublicDealership } from "../../../../shared/schemas/dealership.ts";

type BodyType = (typeof BODY_TYPES)[number];
type FuelType = (typeof FUEL_TYPES)[number];

export const PAGE_SIZE = 12;
export const DEFAULT_SORT: PublicSort = "newest";

/** Every sort the API knows, in the order the menu offers them. Typed against the contract, so a new one shows up here. */
export const SORT_LABELS: Record<PublicSort, string> = {
  newest: "Newest listings first",
  price_asc: "Price, lowest first",
  price_desc: "Price, highest first",
  odometer_asc: "Odometer, lowest first",
  year_desc: "Year, newest first",
  condition_desc: "Condition index, highest first",
};

export interface StockFilters {
  q: string;
  make: string;
  body: BodyType | "";
  fuel: FuelType | "";
  /** Whole currency units. */
  priceFrom: number | null;
  priceTo: number | null;
  /** In the dealership's distance unit. */
  odometerMax: number | null;
  yearFrom: number | null;
  yearTo: number | null;
  sort: PublicSort;
  page: number;
}

/** The URL parameter of each filter (what a shared link carries). */
export const PARAM = {
  q: "q",
  make: "make",
  body: "body",
  fuel: "fuel",
  priceFrom: "priceFrom",
  priceTo: "priceTo",
  odometerMax: "odometerMax",
  yearFrom: "yearFrom",
  yearTo: "yearTo",
  sort: "sort",
  page: "page",
} as const satisfies Record<keyof StockFilters, string>;

const whole = (s: string | null, max: number): number | null => {
  if (!s || !/^\d{1,11}$/.test(s.trim())) return null;
  const n = Number(s.trim());
  return n <= max ? n : null;
};
const oneOf = <T extends string>(list: readonly T[], s: string | null): T | "" => (s && (list as readonly string[]).includes(s) ? (s as T) : "");

/** Reads the view from the URL; a value the API would refuse is dropped rather than sent. */
export function readFilters(params: URLSearchParams): StockFilters {
  const sort = params.get(PARAM.sort);
  return {
    q: (params.get(PARAM.q) ?? "").trim().slice(0, 80),
    make: (params.get(PARAM.make) ?? "").trim().slice(0, 60),
    body: oneOf(BODY_TYPES, params.get(PARAM.body)),
    fuel: oneOf(FUEL_TYPES, params.get(PARAM.fuel)),
    priceFrom: whole(params.get(PARAM.priceFrom), 100_000_000),
    priceTo: whole(params.get(PARAM.priceTo), 100_000_000),
    odometerMax: whole(params.get(PARAM.odometerMax), 3_000_000),
    yearFrom: whole(params.get(PARAM.yearFrom), 2100),
    yearTo: whole(params.get(PARAM.yearTo), 2100),
    sort: sort && sort in SORT_LABELS ? (sort as PublicSort) : DEFAULT_SORT,
    page: Math.max(1, whole(params.get(PARAM.page), 10_000) ?? 1),
  };
}

/** True when the API query cannot be built before the dealership's currency and distance unit are known. */
export const needsDealership = (f: StockFilters) => f.priceFrom !== null || f.priceTo !== null || f.odometerMax !== null;

/** Digits of the currency's minor unit (2 for AUD, 0 for JPY), as Intl knows them. */
export function minorUnitDigits(currency: string): number {
  try {
    return new Intl.NumberFormat("en", { style: "currency", currency }).resolvedOptions().maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

export function toApiQuery(f: StockFilters, market: Pick<PublicDealership, "currency" | "distanceUnit"> | null): PublicListQuery {
  const minor = market ? 10 ** minorUnitDigits(market.currency) : null;
  const km = (value: number) => (market?.distanceUnit === "mi" ? Math.ceil(milesToKm(value) ?? value) : value);
  const q: PublicListQuery = {
    q: f.q || undefined,
    make: f.make || undefined,
    bodyType: f.body || undefined,
    fuelType: f.fuel || undefined,
    priceMin: f.priceFrom !== null && minor !== null ? f.priceFrom * minor : undefined,
    priceMax: f.priceTo !== null && minor !== null ? f.priceTo * minor : undefined,
    odometerMax: f.odometerMax !== null && market ? km(f.odometerMax) : undefined,
    yearMin: f.yearFrom ?? undefined,
    yearMax: f.yearTo ?? undefined,
    sort: f.sort === DEFAULT_SORT ? undefined : f.sort,
    page: f.page > 1 ? f.page : undefined,
    pageSize: PAGE_SIZE,
  };
  // Undefined keys out, so equal views share one cache entry.
  return Object.fromEntries(Object.entries(q).filter(([, v]) => v !== undefined));
}

/** How many filters narrow the view (the search box and the sort are not counted). */
export const activeFilterCount = (f: StockFilters) =>
  [f.make, f.body, f.fuel, f.priceFrom, f.priceTo, f.odometerMax, f.yearFrom, f.yearTo].filter((v) => v !== "" && v !== null).length;

/** The search string for a changed view: unset values removed, the page reset unless it is the change. */
export function nextSearch(current: URLSearchParams, changes: Partial<Record<keyof StockFilters, string | number | null>>): URLSearchParams {
  const next = new URLSearchParams(current);
  for (const [key, value] of Object.entries(changes) as Array<[keyof StockFilters, string | number | null]>) {
    const name = PARAM[key];
    if (value === null || value === "" || (key === "sort" && value === DEFAULT_SORT) || (key === "page" && value === 1)) next.delete(name);
    else next.set(name, String(value));
  }
  if (!("page" in changes)) next.delete(PARAM.page);
  return next;
}
