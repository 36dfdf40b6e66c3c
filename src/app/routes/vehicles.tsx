import { useState, type FormEvent, type ReactNode } from "react";
import { Link, useSearchParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { useVehicleList, suggestionsQueryOptions } from "../../features/vehicles/api/vehicles.ts";
import { StockTable } from "../../features/vehicles/components/StockTable.tsx";
import { useDealership } from "../../features/settings/api/dealership.ts";
import { useStaffUser } from "../RequireAction.tsx";
import { useDraft } from "../../components/form/use-draft.ts";
import { can } from "../../../shared/permissions.ts";
import { PageHeader } from "../../components/ui/Page.tsx";
import { Button } from "../../components/ui/Button.tsx";
import { EmptyState, Loading, Notice } from "../../components/feedback/Notice.tsx";
import { FUEL_TYPES, LABELS, VEHICLE_STATUSES } from "../../../shared/constants/vehicle.ts";
import { SORTS, type VehicleListQuery, type VehicleSort } from "../../../shared/schemas/vehicles.ts";

const PAGE_SIZE = 25;
const input = "min-h-11 rounded-md border border-line-strong bg-paper-raised px-3";
const whole = (s: string | null) => (s && /^\d+$/.test(s) ? Number(s) : undefined);

/** The URL is the state: every filter, the sort and the page live in the query string, so a link reproduces the view. */
function useFilters() {
  const [params, setParams] = useSearchParams();
  const sort = (SORTS as readonly string[]).includes(params.get("sort") ?? "") ? (params.get("sort") as VehicleSort) : "days_desc";
  const statuses = (params.get("status") ?? "").split(",").filter((s) => (VEHICLE_STATUSES as readonly string[]).includes(s));
  const api: VehicleListQuery = {
    q: params.get("q") || undefined,
    status: statuses.length ? (statuses as VehicleListQuery["status"]) : undefined,
    make: params.get("make") || undefined,
    fuelType: params.get("fuel") ? ([params.get("fuel")] as VehicleListQuery["fuelType"]) : undefined,
    priceMin: whole(params.get("priceFrom")) !== undefined ? whole(params.get("priceFrom"))! * 100 : undefined,
    priceMax: whole(params.get("priceTo")) !== undefined ? whole(params.get("priceTo"))! * 100 : undefined,
    odometerMin: whole(params.get("kmFrom")),
    odometerMax: whole(params.get("kmTo")),
    sort,
    page: whole(params.get("page")) ?? 1,
    pageSize: PAGE_SIZE,
  };
  const set = (changes: Record<string, string | undefined>, resetPage = true) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(changes)) {
      if (v) next.set(k, v);
      else next.delete(k);
    }
    if (resetPage && !("page" in changes)) next.delete("page");
    setParams(next, { replace: false });
  };
  return { params, api, set, sort };
}

export default function VehiclesRoute() {
  const user = useStaffUser();
  const { params, api, set, sort } = useFilters();
  const list = useVehicleList(api);
  const dealership = useDealership();
  const makes = useQuery(suggestionsQueryOptions(""));
  // Any change to the URL puts the box back to the search it holds.
  const [q, setQ] = useDraft(params.get("q") ?? "", params.toString());

  const currency = dealership.data?.dealership.currency ?? "AUD";
  const locale = dealership.data?.dealership.locale ?? "en";
  const canCreate = can(user, "vehicle.create");
  const filtered = [...params.keys()].some((k) => k !== "sort" && k !== "page");
  const activeFilters = new Set([...params.keys()].filter((k) => k !== "sort" && k !== "page" && k !== "q").map((k) => k.replace(/From$|To$/, ""))).size;
  const [showFilters, setShowFilters] = useState(false);

  function search(e: FormEvent) {
    e.preventDefault();
    set({ q: q.trim() || undefined });
  }

  return (
    <>
      <PageHeader
        title="Stock"
        lead="Every vehicle on the books. Search by stock number, VIN, plate, make or model."
        actions={canCreate ? <Link to="/app/vehicles/new" className="inline-flex min-h-11 items-center rounded-md border border-signal-strong bg-signal px-4 font-bold text-paper-raised no-underline hover:bg-signal-strong hover:text-paper-raised">Add a vehicle</Link> : null}
      />
      <form onSubmit={search} role="search" className="mb-4 flex flex-wrap gap-2">
        <label htmlFor="stock-q" className="sr-only">Search stock</label>
        <input id="stock-q" type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Stock no., VIN, plate, make, model" className={`${input} min-w-72 flex-1 font-mono`} />
        <Button type="submit" tone="secondary">Search</Button>
      </form>
      {/* On a phone the filters fold away behind one button so the list starts on the first screen. */}
      <Button type="button" tone="secondary" className="mb-4 sm:hidden" aria-expanded={showFilters} aria-controls="stock-filters" onClick={() => setShowFilters((v) => !v)}>
        {showFilters ? "Hide filters" : activeFilters ? `Filters (${activeFilters} on)` : "Filters"}
      </Button>
      <fieldset id="stock-filters" className={`mb-6 gap-3 rounded-lg border border-line bg-paper-raised p-4 sm:grid sm:grid-cols-2 lg:grid-cols-4 ${showFilters ? "grid" : "hidden"}`}>
        <legend className="px-1 text-sm font-bold">Filters</legend>
        <ParamMenu label="Status" any="Any status" value={params.get("status")} onChange={(status) => set({ status })}>
          <option value="intake,preparing">In preparation</option>
          <option value="live,reserved">On sale (live or reserved)</option>
          {VEHICLE_STATUSES.map((s) => <option key={s} value={s}>{LABELS.status[s]}</option>)}
        </ParamMenu>
        <ParamMenu label="Make" any="Any make" value={params.get("make")} onChange={(make) => set({ make })}>
          {(makes.data?.makes ?? []).map((m) => <option key={m} value={m}>{m}</option>)}
        </ParamMenu>
        <ParamMenu label="Fuel" any="Any fuel" value={params.get("fuel")} onChange={(fuel) => set({ fuel })}>
          {FUEL_TYPES.map((f) => <option key={f} value={f}>{LABELS.fuelType[f]}</option>)}
        </ParamMenu>
        <label className="flex flex-col gap-1 text-sm font-bold">
          Sort
          <select className={input} value={sort} onChange={(e) => set({ sort: e.target.value })}>
            <option value="days_desc">Longest in stock first</option>
            <option value="days_asc">Newest arrivals first</option>
            <option value="price_asc">Price, lowest first</option>
            <option value="price_desc">Price, highest first</option>
            <option value="odometer_asc">Odometer, lowest first</option>
            <option value="odometer_desc">Odometer, highest first</option>
            <option value="year_desc">Year, newest first</option>
            <option value="year_asc">Year, oldest first</option>
            <option value="updated_desc">Recently edited</option>
          </select>
        </label>
        <RangeFilter label={`Price (${currency})`} from={params.get("priceFrom")} to={params.get("priceTo")} onApply={(a, b) => set({ priceFrom: a, priceTo: b })} />
        <RangeFilter label="Odometer (km)" from={params.get("kmFrom")} to={params.get("kmTo")} onApply={(a, b) => set({ kmFrom: a, kmTo: b })} />
        {filtered ? (
          <div className="flex items-end">
            <Button type="button" tone="quiet" onClick={() => set({ q: undefined, status: undefined, make: undefined, fuel: undefined, priceFrom: undefined, priceTo: undefined, kmFrom: undefined, kmTo: undefined })}>
              Clear filters
            </Button>
          </div>
        ) : null}
      </fieldset>

      {list.isPending ? (
        <Loading label="Loading stock…" />
      ) : list.isError ? (
        <Notice tone="danger" title="The stock list could not load">{list.error.message}</Notice>
      ) : list.data.total === 0 ? (
        <EmptyState title={filtered ? "No vehicles match these filters" : "No vehicles yet"}>
          {filtered ? "Loosen a filter or clear them all." : canCreate ? "Add the first trade-in with “Add a vehicle”." : "Vehicles appear here once sales adds them."}
        </EmptyState>
      ) : (
        <>
          <p className="mb-2 text-sm text-ink-soft" aria-live="polite">
            {list.data.total} vehicle{list.data.total === 1 ? "" : "s"}
            {list.isFetching ? " · updating…" : ""}
          </p>
          <StockTable rows={list.data.vehicles} currency={currency} locale={locale} sort={sort} onSort={(s) => set({ sort: s })} />
          <nav aria-label="Pages" className="mt-4 flex items-center justify-between gap-4">
            <Button tone="secondary" disabled={list.data.page <= 1} onClick={() => set({ page: String(list.data.page - 1) }, false)}>Previous</Button>
            <span className="text-sm figures">Page {list.data.page} of {list.data.pageCount}</span>
            <Button tone="secondary" disabled={list.data.page >= list.data.pageCount} onClick={() => set({ page: String(list.data.page + 1) }, false)}>Next</Button>
          </nav>
        </>
      )}
    </>
  );
}

interface ParamMenuProps {
  label: string;
  any: string;
  value: string | null;
  onChange: (v?: string) => void;
  children: ReactNode;
}

/** A filter menu over one URL parameter; its first choice, "any", takes the parameter away. */
function ParamMenu({ label, any, value, onChange, children }: ParamMenuProps) {
  return (
    <label className="flex flex-col gap-1 text-sm font-bold">
      {label}
      <select className={input} value={value ?? ""} onChange={(e) => onChange(e.target.value || undefined)}>
        <option value="">{any}</option>
        {children}
      </select>
    </label>
  );
}

function RangeFilter({ label, from, to, onApply }: { label: string; from: string | null; to: string | null; onApply: (a?: string, b?: string) => void }) {
  const both = JSON.stringify([from, to]);
  const [a, setA] = useDraft(from ?? "", both);
  const [b, setB] = useDraft(to ?? "", both);
  const apply = () => onApply(a.replace(/\D/g, "") || undefined, b.replace(/\D/g, "") || undefined);
  const cls = "min-h-11 w-full rounded-md border border-line-strong bg-paper-raised px-3 figures";
  return (
    <div className="flex flex-col gap-1 text-sm font-bold">
      <span>{label}</span>
      <div className="flex items-center gap-2">
        <input aria-label={`${label} from`} inputMode="numeric" placeholder="from" className={cls} value={a} onChange={(e) => setA(e.target.value)} onBlur={apply} onKeyDown={(e) => e.key === "Enter" && apply()} />
        <span aria-hidden>–</span>
        <input aria-label={`${label} to`} inputMode="numeric" placeholder="to" className={cls} value={b} onChange={(e) => setB(e.target.value)} onBlur={apply} onKeyDown={(e) => e.key === "Enter" && apply()} />
      </div>
    </div>
  );
}
