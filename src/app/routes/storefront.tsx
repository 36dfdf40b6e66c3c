import type { FormEvent } from "react";
import { useSearchParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { storefrontDealershipQueryOptions, storefrontListQueryOptions } from "../../features/storefront/api/storefront.ts";
import { needsDealership, nextSearch, PAGE_SIZE, readFilters, SORT_LABELS, toApiQuery, type StockFilters } from "../../features/storefront/api/filters.ts";
import { SiteFooter, SiteHeader } from "../../features/storefront/components/SiteChrome.tsx";
import { StockFilterPanel } from "../../features/storefront/components/StockFilterPanel.tsx";
import { VehicleCard } from "../../features/storefront/components/VehicleCard.tsx";
import { Pagination } from "../../features/storefront/components/Pagination.tsx";
import { useDocumentTitle } from "../../features/storefront/components/useDocumentTitle.ts";
import { count, label, telHref } from "../../features/storefront/format.ts";
import { EmptyState, Loading, Notice } from "../../components/feedback/Notice.tsx";
import { useDraft } from "../../components/form/use-draft.ts";
import { formatNumber } from "../../../shared/domain/display.ts";
import type { PublicSort } from "../../../shared/schemas/public-query.ts";
import "../../print.css";

type Changes = Partial<Record<keyof StockFilters, string | number | null>>;

/** The public front page: the dealership's live stock, searched and filtered, with the whole view in the URL. */
export default function Storefront() {
  const [params, setParams] = useSearchParams();
  const filters = readFilters(params);
  const dealershipQuery = useQuery(storefrontDealershipQueryOptions());
  const known = dealershipQuery.data?.dealership ?? null;
  const waiting = needsDealership(filters) && !known;
  const list = useQuery({ ...storefrontListQueryOptions(toApiQuery(filters, known)), enabled: !waiting });
  const dealership = list.data?.dealership ?? known;
  const locale = dealership?.locale || "en";

  const [q, setQ] = useDraft(filters.q);

  useDocumentTitle(dealership ? `Vehicles for sale — ${dealership.name}` : "Vehicles for sale");

  const change = (changes: Changes) => setParams(nextSearch(params, changes));
  const search = (e: FormEvent) => {
    e.preventDefault();
    change({ q: q.trim() || null });
  };
  const narrowed = filters.q !== "" || [...params.keys()].some((k) => !["sort", "page", "q"].includes(k));
  const chips = activeChips(filters, dealership?.currency ?? null, dealership?.distanceUnit ?? "km", locale);

  const data = list.data;
  const first = data ? (data.page - 1) * PAGE_SIZE + 1 : 0;

  return (
    <div className="flex min-h-dvh flex-col">
      <SiteHeader dealership={dealership} />
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-8 sm:px-6">
        <h1 className="text-3xl font-bold">Vehicles for sale</h1>
        <p className="mt-2 max-w-prose text-ink">
          Every vehicle comes with its condition report: photos, each mark we found, tyre measurements and the checks we ran.
        </p>

        <form role="search" onSubmit={search} className="mt-6 flex max-w-2xl flex-wrap items-end gap-2">
          <label htmlFor="stock-search" className="w-full text-sm font-bold">
            Search by make, model or words in the listing
          </label>
          <input
            id="stock-search"
            type="search"
            value={q}
            onChange={(e) => setQ(e.target.value)}
            maxLength={80}
            className="min-h-11 min-w-0 flex-1 rounded-md border border-line-strong bg-paper-raised px-3 text-base"
          />
          <button type="submit" className="inline-flex min-h-11 items-center rounded-md border border-signal-strong bg-signal px-5 font-bold text-paper-raised hover:bg-signal-strong">
            Search
          </button>
        </form>

        <div className="mt-6 grid grid-cols-1 gap-6 lg:grid-cols-[15rem_minmax(0,1fr)] lg:items-start">
          <StockFilterPanel filters={filters} facets={data?.facets ?? null} dealership={dealership} onChange={change} />

          <section aria-labelledby="results-heading" className="min-w-0">
            <div className="flex flex-wrap items-end justify-between gap-3 border-b border-line pb-3">
              <h2 id="results-heading" className="text-lg font-bold" aria-live="polite">
                {data ? (
                  data.total === 0 ? (
                    "No vehicles"
                  ) : (
                    <>
                      {count(data.total, "vehicle", "vehicles", locale)}
                      {data.pageCount > 1 ? (
                        <span className="font-normal text-ink-soft figures">
                          {" "}
                          · showing {formatNumber(first, { locale })}–{formatNumber(first + data.vehicles.length - 1, { locale })}
                        </span>
                      ) : null}
                    </>
                  )
                ) : (
                  "Vehicles"
                )}
                {list.isFetching && !list.isPending ? <span className="ml-2 text-sm font-normal text-ink-soft">Updating…</span> : null}
              </h2>
              <label className="flex items-center gap-2 text-sm font-bold">
                Sort
                <select
                  className="min-h-11 rounded-md border border-line-strong bg-paper-raised px-3 text-base font-normal"
                  value={filters.sort}
                  onChange={(e) => change({ sort: e.target.value })}
                >
                  {(Object.keys(SORT_LABELS) as PublicSort[]).map((s) => (
                    <option key={s} value={s}>
                      {SORT_LABELS[s]}
                    </option>
                  ))}
                </select>
              </label>
            </div>

            {chips.length || filters.q ? (
              <ul aria-label="Your search" className="mt-3 flex flex-wrap gap-2">
                {filters.q ? (
                  <li>
                    <Chip text={`“${filters.q}”`} onRemove={() => change({ q: null })} what="the search words" />
                  </li>
                ) : null}
                {chips.map((c) => (
                  <li key={c.key}>
                    <Chip text={c.text} onRemove={() => change(c.clear)} what={c.text} />
                  </li>
                ))}
              </ul>
            ) : null}

            <div className="mt-5">
              {waiting || list.isPending ? (
                <Loading label="Loading vehicles…" />
              ) : list.isError && !data ? (
                <Notice tone="danger" title="The vehicles could not be loaded">
                  <p>{list.error.message}</p>
                  <button type="button" className="mt-2 font-bold text-signal underline" onClick={() => void list.refetch()}>
                    Try again
                  </button>
                </Notice>
              ) : data && data.vehicles.length === 0 ? (
                <EmptyState title={narrowed ? "No vehicles match this search" : filters.page > 1 ? "There is nothing on this page" : "No vehicles are listed right now"}>
                  {narrowed ? (
                    <>
                      <p>Try fewer filters or other words.</p>
                      <button
                        type="button"
                        className="mt-3 inline-flex min-h-11 items-center rounded-md border border-line-strong bg-paper-raised px-4 font-bold text-ink"
                        onClick={() => setParams(new URLSearchParams())}
                      >
                        Show every vehicle
                      </button>
                    </>
                  ) : filters.page > 1 ? (
                    <button type="button" className="mt-2 font-bold text-signal underline" onClick={() => change({ page: 1 })}>
                      Go to the first page
                    </button>
                  ) : (
                    <p>
                      New stock is being prepared and each vehicle appears here with its condition report once it is ready.
                      {dealership?.phone ? (
                        <>
                          {" "}
                          Call us on <a href={telHref(dealership.phone)}>{dealership.phone}</a> to ask what is arriving.
                        </>
                      ) : null}
                    </p>
                  )}
                </EmptyState>
              ) : data ? (
                <>
                  <ul className="grid grid-cols-1 gap-5 sm:grid-cols-2 xl:grid-cols-3">
                    {data.vehicles.map((v, i) => (
                      <li key={v.slug} className="flex">
                        <VehicleCard card={v} index={i} locale={locale} distanceUnit={dealership?.distanceUnit ?? "km"} />
                      </li>
                    ))}
                  </ul>
                  <Pagination page={data.page} pageCount={data.pageCount} locale={locale} href={(p) => `?${nextSearch(params, { page: p }).toString()}`} />
                </>
              ) : null}
            </div>
          </section>
        </div>
      </main>
      <SiteFooter dealership={dealership} />
    </div>
  );
}

function Chip({ text, onRemove, what }: { text: string; onRemove: () => void; what: string }) {
  return (
    <button
      type="button"
      onClick={onRemove}
      className="inline-flex min-h-11 items-center gap-2 rounded-md border border-line-strong bg-paper-raised px-3 text-sm font-bold text-ink hover:border-ink"
    >
      {text}
      <span aria-hidden className="text-base text-ink-soft">×</span>
      <span className="sr-only">: remove {what}</span>
    </button>
  );
}

function activeChips(f: StockFilters, currency: string | null, unit: "km" | "mi", locale: string) {
  const n = (v: number) => formatNumber(v, { locale });
  const out: Array<{ key: string; text: string; clear: Changes }> = [];
  if (f.make) out.push({ key: "make", text: f.make, clear: { make: null } });
  if (f.body) out.push({ key: "body", text: label("bodyType", f.body) ?? f.body, clear: { body: null } });
  if (f.fuel) out.push({ key: "fuel", text: label("fuelType", f.fuel) ?? f.fuel, clear: { fuel: null } });
  const c = currency ? ` ${currency}` : "";
  if (f.priceFrom !== null && f.priceTo !== null) out.push({ key: "price", text: `${n(f.priceFrom)}–${n(f.priceTo)}${c}`, clear: { priceFrom: null, priceTo: null } });
  else if (f.priceFrom !== null) out.push({ key: "price", text: `From ${n(f.priceFrom)}${c}`, clear: { priceFrom: null } });
  else if (f.priceTo !== null) out.push({ key: "price", text: `Up to ${n(f.priceTo)}${c}`, clear: { priceTo: null } });
  if (f.odometerMax !== null) out.push({ key: "odo", text: `Up to ${n(f.odometerMax)} ${unit}`, clear: { odometerMax: null } });
  if (f.yearFrom !== null && f.yearTo !== null) out.push({ key: "year", text: `${f.yearFrom}–${f.yearTo}`, clear: { yearFrom: null, yearTo: null } });
  else if (f.yearFrom !== null) out.push({ key: "year", text: `${f.yearFrom} or newer`, clear: { yearFrom: null } });
  else if (f.yearTo !== null) out.push({ key: "year", text: `${f.yearTo} or older`, clear: { yearTo: null } });
  return out;
}
