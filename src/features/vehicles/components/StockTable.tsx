import { useMemo } from "react";
import { Link } from "react-router";
import { createColumnHelper, flexRender, getCoreRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import type { VehicleRow } from "../api/vehicles.ts";
import type { VehicleSort } from "../../../../shared/schemas/vehicles.ts";
import { StatusBadge } from "./StatusBadge.tsx";
import { DASH, label, odometerText, priceText } from "../format.ts";

const col = createColumnHelper<VehicleRow>();

/** Which server sort each sortable column maps to. */
const SORTABLE: Record<string, [VehicleSort, VehicleSort]> = {
  daysInStock: ["days_asc", "days_desc"],
  priceCents: ["price_asc", "price_desc"],
  odometer: ["odometer_asc", "odometer_desc"],
  buildYear: ["year_asc", "year_desc"],
};

export function sortToState(sort: VehicleSort): SortingState {
  for (const [id, [asc, desc]] of Object.entries(SORTABLE)) {
    if (sort === asc) return [{ id, desc: false }];
    if (sort === desc) return [{ id, desc: true }];
  }
  return [];
}

interface Props {
  rows: VehicleRow[];
  currency: string;
  locale: string;
  sort: VehicleSort;
  onSort: (s: VehicleSort) => void;
}

export function StockTable({ rows, currency, locale, sort, onSort }: Props) {
  const columns = useMemo(
    () => [
      col.accessor("stockNumber", {
        header: "Stock no.",
        cell: (c) => (
          <Link to={`/app/vehicles/${c.row.original.id}`} className="font-mono font-bold">
            {c.getValue()}
          </Link>
        ),
      }),
      col.display({
        id: "vehicle",
        header: "Vehicle",
        cell: (c) => {
          const v = c.row.original;
          return (
            <div>
              <Link to={`/app/vehicles/${v.id}`} className="font-bold text-ink no-underline hover:underline">
                {v.make} {v.model}
              </Link>
              <div className="text-xs text-ink-soft">{[v.variant, v.colour, label("fuelType", v.fuelType)].filter((x) => x && x !== DASH).join(" · ")}</div>
            </div>
          );
        },
      }),
      col.accessor("buildYear", { header: "Year", cell: (c) => <span className="figures">{c.getValue() ?? DASH}</span> }),
      col.display({
        id: "ids",
        header: "Plate / VIN",
        cell: (c) => (
          <div className="font-mono text-xs leading-5">
            <div>{c.row.original.registrationPlate ?? DASH}</div>
            <div className="text-ink-soft">
              {c.row.original.vin ?? "no VIN"}
              {c.row.original.vinCheck === "invalid" ? <span className="ml-1 font-sans font-bold text-ochre">(check digit)</span> : null}
            </div>
          </div>
        ),
      }),
      col.accessor("status", { header: "Status", cell: (c) => <StatusBadge status={c.getValue()} /> }),
      col.accessor((r) => r.odometerKm, { id: "odometer", header: "Odometer", cell: (c) => <span className="figures">{odometerText(c.row.original, locale)}</span> }),
      col.accessor("priceCents", { header: "Price", cell: (c) => <span className="figures">{priceText(c.getValue(), currency, locale)}</span> }),
      col.accessor("daysInStock", { header: "Days in stock", cell: (c) => <span className="figures">{c.getValue()}</span> }),
    ],
    [currency, locale],
  );

  // The table instance is mutable and read fresh on every render; the compiler only skips memoising this component.
  // eslint-disable-next-line react-hooks/incompatible-library -- nothing here is memoised by hand around it
  const table = useReactTable({
    data: rows,
    columns,
    getCoreRowModel: getCoreRowModel(),
    manualSorting: true,
    manualPagination: true,
    state: { sorting: sortToState(sort) },
    enableSortingRemoval: false,
  });

  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-paper-raised">
      <table className="w-full min-w-[60rem] text-left text-sm">
        <caption className="sr-only">Vehicles in stock</caption>
        <thead className="border-b border-line bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => {
                const pair = SORTABLE[h.column.id];
                const state = h.column.getIsSorted();
                return (
                  <th key={h.id} scope="col" className="px-4 py-3 font-bold" aria-sort={state === "asc" ? "ascending" : state === "desc" ? "descending" : undefined}>
                    {pair ? (
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 uppercase hover:text-ink"
                        onClick={() => onSort(state === "desc" ? pair[0] : pair[1])}
                      >
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        <span aria-hidden className="text-signal">{state === "asc" ? "▲" : state === "desc" ? "▼" : "↕"}</span>
                      </button>
                    ) : (
                      flexRender(h.column.columnDef.header, h.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((r) => (
            <tr key={r.id} className="border-b border-line align-top last:border-0 hover:bg-paper">
              {r.getVisibleCells().map((c) => (
                <td key={c.id} className="px-4 py-3">
                  {flexRender(c.column.columnDef.cell, c.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
