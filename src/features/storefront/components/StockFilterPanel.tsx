import { useId, useState, type FormEvent, type ReactNode } from "react";
import { useDraft } from "../../../components/form/use-draft.ts";
import { BODY_TYPES, FUEL_TYPES } from "../../../../shared/constants/vehicle.ts";
import type { PublicDealership } from "../../../../shared/schemas/dealership.ts";
import { activeFilterCount, type StockFilters } from "../api/filters.ts";
import { label } from "../format.ts";

type Changes = Partial<Record<keyof StockFilters, string | number | null>>;
type NumberKey = "priceFrom" | "priceTo" | "odometerMax" | "yearFrom" | "yearTo";
const NUMBER_KEYS: NumberKey[] = ["priceFrom", "priceTo", "odometerMax", "yearFrom", "yearTo"];

const control = "min-h-11 w-full rounded-md border border-line-strong bg-paper-raised px-3 text-base text-ink";
const fieldLabel = "flex flex-col gap-1 text-sm font-bold";

/** "25,000" or "25 000" → 25000; anything else is not a whole number. */
const parseWhole = (s: string): number | null | "invalid" => {
  const t = s.replace(/[\s,.'_\u2009\u00a0]/g, "");
  if (!t) return null;
  return /^\d{1,11}$/.test(t) ? Number(t) : "invalid";
};

const numbersOf = (f: StockFilters) => Object.fromEntries(NUMBER_KEYS.map((k) => [k, f[k] === null ? "" : String(f[k])])) as Record<NumberKey, string>;

/**
 * The filters. A menu applies as soon as it changes; the typed figures apply together with "Show vehicles" (or
 * Enter), so the list does not jump while someone is typing a price.
 */
export function StockFilterPanel({
  filters,
  facets,
  dealership,
  onChange,
}: {
  filters: StockFilters;
  facets: { makes: string[]; bodyTypes: string[]; fuelTypes: string[] } | null;
  dealership: Pick<PublicDealership, "currency" | "distanceUnit"> | null;
  onChange: (changes: Changes) => void;
}) {
  const id = useId();
  // The URL is the truth: back and forward put the fields back as they were.
  const key = NUMBER_KEYS.map((k) => filters[k]).join("|");
  const [numbers, setNumbers] = useDraft(numbersOf(filters), key);
  const [invalid, setInvalid] = useDraft<NumberKey[]>([], key);
  const [open, setOpen] = useState(false);

  const apply = (e: FormEvent) => {
    e.preventDefault();
    const parsed = NUMBER_KEYS.map((k) => [k, parseWhole(numbers[k])] as const);
    const bad = parsed.filter(([, v]) => v === "invalid").map(([k]) => k);
    setInvalid(bad);
    if (bad.length) return;
    onChange(Object.fromEntries(parsed));
  };

  const n = activeFilterCount(filters);
  const makes = withCurrent(facets?.makes ?? [], filters.make);
  const bodies = withCurrent(facets?.bodyTypes.length ? facets.bodyTypes : [...BODY_TYPES], filters.body);
  const fuels = withCurrent(facets?.fuelTypes.length ? facets.fuelTypes : [...FUEL_TYPES], filters.fuel);
  const unit = dealership?.distanceUnit ?? "km";
  const currency = dealership?.currency ?? "";

  const numberField = (k: NumberKey, text: string, hint?: string) => (
    <label className={fieldLabel} key={k}>
      {text}
      <input
        className={`${control} figures ${invalid.includes(k) ? "border-2 border-brick" : ""}`}
        inputMode="numeric"
        autoComplete="off"
        value={numbers[k]}
        aria-invalid={invalid.includes(k) || undefined}
        aria-describedby={invalid.includes(k) ? `${id}-${k}-error` : undefined}
        placeholder={hint}
        onChange={(e) => setNumbers((s) => ({ ...s, [k]: e.target.value }))}
      />
      {invalid.includes(k) ? (
        <span id={`${id}-${k}-error`} className="font-normal text-brick">
          Type a whole number, like {k.startsWith("year") ? "2018" : "25000"}.
        </span>
      ) : null}
    </label>
  );

  return (
    <div>
      <button
        type="button"
        className="inline-flex min-h-11 w-full items-center justify-between rounded-md border border-line-strong bg-paper-raised px-4 font-bold lg:hidden"
        aria-expanded={open}
        aria-controls={`${id}-panel`}
        onClick={() => setOpen((o) => !o)}
      >
        <span>Filters{n ? ` (${n} on)` : ""}</span>
        <span aria-hidden className="text-signal">{open ? "Hide" : "Show"}</span>
      </button>
      <form id={`${id}-panel`} onSubmit={apply} className={`${open ? "mt-3 flex" : "hidden"} flex-col gap-4 rounded-lg border border-line bg-paper-raised p-4 lg:mt-0 lg:flex`} aria-label="Filters">
        <h2 className="text-lg font-bold max-lg:sr-only">Filters</h2>
        <Select label="Make" value={filters.make} onChange={(v) => onChange({ make: v })} any="Any make">
          {makes.map((m) => (
            <option key={m} value={m}>{m}</option>
          ))}
        </Select>
        <Select label="Body" value={filters.body} onChange={(v) => onChange({ body: v })} any="Any body">
          {bodies.map((b) => (
            <option key={b} value={b}>{label("bodyType", b)}</option>
          ))}
        </Select>
        <Select label="Fuel" value={filters.fuel} onChange={(v) => onChange({ fuel: v })} any="Any fuel">
          {fuels.map((f) => (
            <option key={f} value={f}>{label("fuelType", f)}</option>
          ))}
        </Select>
        <fieldset className="grid grid-cols-2 gap-3">
          <legend className="mb-1 text-sm font-bold">Price{currency ? ` (${currency})` : ""}</legend>
          {numberField("priceFrom", "From")}
          {numberField("priceTo", "To")}
        </fieldset>
        {numberField("odometerMax", `Odometer up to (${unit})`)}
        <fieldset className="grid grid-cols-2 gap-3">
          <legend className="mb-1 text-sm font-bold">Year</legend>
          {numberField("yearFrom", "From")}
          {numberField("yearTo", "To")}
        </fieldset>
        <button type="submit" className="inline-flex min-h-11 items-center justify-center rounded-md border border-signal-strong bg-signal px-4 font-bold text-paper-raised hover:bg-signal-strong">
          Show vehicles
        </button>
        {n ? (
          <button
            type="button"
            className="inline-flex min-h-11 items-center justify-center rounded-md px-4 font-bold text-signal hover:bg-signal-wash"
            onClick={() => onChange({ make: null, body: null, fuel: null, priceFrom: null, priceTo: null, odometerMax: null, yearFrom: null, yearTo: null })}
          >
            Clear all filters
          </button>
        ) : null}
      </form>
    </div>
  );
}

interface SelectProps {
  label: string;
  value: string;
  onChange: (v: string | null) => void;
  any: string;
  children: ReactNode;
}

function Select({ label: text, value, onChange, any, children }: SelectProps) {
  return (
    <label className={fieldLabel}>
      {text}
      <select className={control} value={value} onChange={(e) => onChange(e.target.value || null)}>
        <option value="">{any}</option>
        {children}
      </select>
    </label>
  );
}

/** The URL's value stays selectable even when today's stock has none of it, so the menu shows the real view. */
const withCurrent = (list: string[], current: string) => (current && !list.includes(current) ? [...list, current] : list);
