// The public pages' reads: one key factory, one queryOptions per read. Public pages import nothing from the staff
// features; the answers' shapes are the contract in shared/schemas/public.ts.
import { keepPreviousData, queryOptions } from "@tanstack/react-query";
import { ApiError, safeJson } from "../../../lib/api-client.ts";
import type { PublicListQuery } from "../../../../shared/schemas/public-query.ts";
import type { PublicVehicle, PublicVehicleCard } from "../../../../shared/schemas/public.ts";
import type { PublicDealership } from "../../../../shared/schemas/dealership.ts";

/** GET /api/public/vehicles */
export interface StorefrontList {
  vehicles: PublicVehicleCard[];
  total: number;
  page: number;
  pageCount: number;
  facets: { makes: string[]; bodyTypes: string[]; fuelTypes: string[] };
  dealership: PublicDealership;
}

export const storefrontKeys = {
  all: ["storefront"] as const,
  dealership: () => [...storefrontKeys.all, "dealership"] as const,
  lists: () => [...storefrontKeys.all, "list"] as const,
  list: (filters: PublicListQuery) => [...storefrontKeys.lists(), filters] as const,
  details: () => [...storefrontKeys.all, "detail"] as const,
  detail: (slug: string) => [...storefrontKeys.details(), slug] as const,
  revision: (slug: string, number: number) => [...storefrontKeys.detail(slug), "revision", number] as const,
};

/**
 * A GET that keeps everything the server sent with an error: a withdrawn vehicle answers 410 with the dealership,
 * which the polite page needs. Errors are the client's usual ApiError, so the query client's
 * "4xx is final" retry rule applies.
 */
async function getPublic<T>(path: string, signal?: AbortSignal): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, { headers: { Accept: "application/json" }, credentials: "same-origin", signal });
  } catch (e) {
    if (signal?.aborted) throw e;
    throw new ApiError(0, "network", "We could not reach our website just now. Check your connection and try again.");
  }
  const text = await response.text();
  const data = text ? safeJson(text) : null;
  if (!response.ok) {
    const body = (data && typeof data === "object" ? data : {}) as Record<string, unknown>;
    const { error, ...rest } = body;
    const e = (typeof error === "object" && error !== null ? error : { message: error }) as Record<string, unknown>;
    const { code, message, fields, ...extra } = e;
    // Extras may come inside the error object or beside it; both end up in `details`.
    throw new ApiError(
      response.status,
      typeof code === "string" ? code : `http_${response.status}`,
      typeof message === "string" ? message : `The server answered ${response.status}.`,
      (fields as Record<string, string>) ?? {},
      { ...rest, ...extra },
    );
  }
  return data as T;
}

export function listSearch(filters: PublicListQuery): string {
  const s = new URLSearchParams();
  for (const [k, v] of Object.entries(filters)) if (v !== undefined && v !== "") s.set(k, String(v));
  return s.toString();
}

export const storefrontDealershipQueryOptions = () =>
  queryOptions({
    queryKey: storefrontKeys.dealership(),
    queryFn: ({ signal }) => getPublic<{ dealership: PublicDealership }>("/api/public/dealership", signal),
    staleTime: 5 * 60_000,
  });

export const storefrontListQueryOptions = (filters: PublicListQuery) =>
  queryOptions({
    queryKey: storefrontKeys.list(filters),
    queryFn: ({ signal }) => getPublic<StorefrontList>(`/api/public/vehicles?${listSearch(filters)}`, signal),
    placeholderData: keepPreviousData,
  });

/** The vehicle the server wrote into this page's HTML (pages.routes.ts), read once, when it is the one asked for. */
let embedded: { slug: string; vehicle: PublicVehicle } | null | undefined;
function embeddedVehicle(slug: string): { vehicle: PublicVehicle } | undefined {
  if (embedded === undefined) {
    try {
      const el = typeof document !== "undefined" ? document.getElementById("fr-page-data") : null;
      embedded = el?.textContent ? (JSON.parse(el.textContent) as { slug: string; vehicle: PublicVehicle }) : null;
    } catch {
      embedded = null;
    }
  }
  return embedded && embedded.slug === slug ? { vehicle: embedded.vehicle } : undefined;
}

export const publicVehicleQueryOptions = (slug: string) =>
  queryOptions({
    queryKey: storefrontKeys.detail(slug),
    queryFn: ({ signal }) => getPublic<{ vehicle: PublicVehicle }>(`/api/public/vehicles/${encodeURIComponent(slug)}`, signal),
    initialData: () => embeddedVehicle(slug),
    initialDataUpdatedAt: () => (embeddedVehicle(slug) ? Date.now() : undefined),
    staleTime: 60_000,
  });

/** An older revision never changes once published, so it is never refetched. */
export const publicRevisionQueryOptions = (slug: string, number: number) =>
  queryOptions({
    queryKey: storefrontKeys.revision(slug, number),
    queryFn: ({ signal }) =>
      getPublic<{ vehicle: PublicVehicle }>(`/api/public/vehicles/${encodeURIComponent(slug)}/revisions/${number}`, signal),
    staleTime: Infinity,
    gcTime: 30 * 60_000,
  });

/** The SVG QR code of the page's absolute URL, for the window card. */
export const qrCodeUrl = (slug: string) => `/api/public/vehicles/${encodeURIComponent(slug)}/qr.svg`;

/** The dealership sent with a 410 (withdrawn) answer, when there is one. */
export function withdrawnDealership(error: unknown): PublicDealership | null {
  if (!(error instanceof ApiError) || error.status !== 410) return null;
  const d = error.details.dealership;
  return d && typeof d === "object" ? (d as PublicDealership) : null;
}
