import { useRef, type FormEvent } from "react";
import { createFeedSchema, DEFAULT_COLUMNS, FEED_FORMATS, FEED_FORMAT_LABELS, FEED_STATUSES, FORMATS_WITH_COLUMNS, takesWidth, type FeedFormat } from "../../../../shared/schemas/feeds.ts";
import { BODY_TYPES, FUEL_TYPES, LABELS } from "../../../../shared/constants/vehicle.ts";
import { isApiError } from "../../../lib/api-client.ts";
import { SelectField, TextField } from "../../../components/form/Field.tsx";
import { flatErrors, setServerErrors, useZodFormAsTyped } from "../../../components/form/use-zod-form.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { useCreateFeed, usePreviewFeed } from "../api/feeds.ts";
import { ColumnPicker, type ColumnDraft } from "./ColumnPicker.tsx";
import { PreviewTable } from "./PreviewTable.tsx";

interface Draft {
  name: string;
  format: FeedFormat;
  units: "market" | "metric";
  statuses: string[];
  makes: string;
  bodyTypes: string[];
  fuelTypes: string[];
  priceMin: string;
  priceMax: string;
  daysMin: string;
  daysMax: string;
  columns: ColumnDraft[];
}

const defaults = (): Draft => ({
  name: "", format: "csv", units: "market", statuses: ["live", "reserved"], makes: "", bodyTypes: [], fuelTypes: [], priceMin: "", priceMax: "", daysMin: "", daysMax: "",
  columns: DEFAULT_COLUMNS.map((key) => ({ key, header: key, photoWidth: takesWidth(key) ? "1024" : "" })),
});

const num = (s: string) => (s.trim() === "" ? undefined : Number(s));
const cents = (s: string) => (s.trim() === "" ? undefined : Math.round(Number(s) * 100));

/** The form's strings to the API body; the same zod schema then checks it here and on the server. */
function toBody(d: Draft) {
  const makes = d.makes.split(",").map((m) => m.trim()).filter(Boolean);
  const filter = {
    statuses: d.statuses,
    ...(makes.length ? { makes } : {}),
    ...(d.bodyTypes.length ? { bodyTypes: d.bodyTypes } : {}),
    ...(d.fuelTypes.length ? { fuelTypes: d.fuelTypes } : {}),
    priceMinCents: cents(d.priceMin), priceMaxCents: cents(d.priceMax), daysInStockMin: num(d.daysMin), daysInStockMax: num(d.daysMax),
  };
  const clean = Object.fromEntries(Object.entries(filter).filter(([, v]) => v !== undefined));
  const withColumns = FORMATS_WITH_COLUMNS.includes(d.format);
  return {
    name: d.name, format: d.format, units: d.units, filter: clean,
    ...(withColumns
      ? { columns: d.columns.map((c) => ({ key: c.key, header: c.header, ...(takesWidth(c.key) ? { photoWidth: Number(c.photoWidth || 1024) } : {}) })) }
      : {}),
  };
}

interface CheckboxesProps {
  legend: string;
  options: ReadonlyArray<readonly [string, string]>;
  value: string[];
  onChange: (v: string[]) => void;
}

function Checkboxes({ legend, options, value, onChange }: CheckboxesProps) {
  return (
    <fieldset>
      <legend className="mb-1 text-sm font-bold">{legend}</legend>
      <div className="flex flex-wrap gap-x-4">
        {options.map(([key, label]) => (
          <label key={key} className="flex min-h-11 items-center gap-2 text-sm">
            <input type="checkbox" className="size-5 accent-signal" checked={value.includes(key)} onChange={(e) => onChange(e.target.checked ? [...value, key] : value.filter((x) => x !== key))} />
            {label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}

export function FeedForm({ onCreated }: { onCreated: (url: string) => void }) {
  // A preview needs no name yet; the same schema checks everything else.
  const purpose = useRef<"preview" | "save">("save");
  const form = useZodFormAsTyped<Draft, typeof createFeedSchema>(
    createFeedSchema,
    (d) => {
      const body = toBody(d);
      return purpose.current === "preview" ? { ...body, name: body.name || "preview" } : body;
    },
    { defaultValues: defaults() },
  );
  const create = useCreateFeed();
  const preview = usePreviewFeed();
  const serverFields = isApiError(create.error) ? create.error.fields : isApiError(preview.error) ? preview.error.fields : {};
  const fields = flatErrors(form.formState.errors);
  const draft = form.watch();
  const set = <K extends keyof Draft>(k: K, v: Draft[K]) => form.setValue(k, v as never);
  const withColumns = FORMATS_WITH_COLUMNS.includes(draft.format);

  // The body as built from what was typed, as before: the schema's output (with its defaults) is only the check.
  const sendPreview = form.handleSubmit(() => {
    const body = toBody(form.getValues());
    preview.mutate({ ...body, name: body.name || undefined, limit: 10 } as never, { onError: (e) => setServerErrors(form, e) });
  });
  const sendCreate = form.handleSubmit(() =>
    create.mutate(toBody(form.getValues()) as never, {
      onSuccess: ({ url }) => {
        onCreated(url);
        form.reset(defaults());
        preview.reset();
      },
      onError: (e) => setServerErrors(form, e),
    }),
  );

  function runPreview() {
    purpose.current = "preview";
    void sendPreview();
  }

  function submit(e: FormEvent) {
    purpose.current = "save";
    void sendCreate(e);
  }

  return (
    <form onSubmit={submit} noValidate aria-label="Create a feed" className="flex flex-col gap-5">
      {(create.error || preview.error) && !Object.keys(serverFields).length ? <Notice tone="danger" title={(create.error ?? preview.error)!.message} /> : null}
      <div className="grid gap-4 md:grid-cols-3">
        <TextField label="Name" {...form.register("name")} error={fields.name} hint="Who it is for, e.g. the portal's name." />
        <SelectField label="Format" {...form.register("format")} error={fields.format}>
          {FEED_FORMATS.map((f) => (
            <option key={f} value={f}>
              {FEED_FORMAT_LABELS[f]}
            </option>
          ))}
        </SelectField>
        <SelectField label="Units" {...form.register("units")} hint="Odometer, range and fuel use.">
          <option value="market">The market's units</option>
          <option value="metric">Metric</option>
        </SelectField>
      </div>
      <div className="grid gap-4 md:grid-cols-2">
        <Checkboxes legend="Statuses" options={FEED_STATUSES.map((s) => [s, LABELS.status[s]] as const)} value={draft.statuses} onChange={(v) => set("statuses", v)} />
        <TextField label="Makes" {...form.register("makes")} hint="Separate with commas; empty for every make." error={fields["filter.makes"]} />
        <Checkboxes legend="Body types" options={BODY_TYPES.map((b) => [b, LABELS.bodyType[b]] as const)} value={draft.bodyTypes} onChange={(v) => set("bodyTypes", v)} />
        <Checkboxes legend="Fuel" options={FUEL_TYPES.map((f) => [f, LABELS.fuelType[f]] as const)} value={draft.fuelTypes} onChange={(v) => set("fuelTypes", v)} />
      </div>
      {fields["filter.statuses"] ? <p className="text-sm font-bold text-brick">{fields["filter.statuses"]}</p> : null}
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <TextField label="Lowest price" inputMode="decimal" {...form.register("priceMin")} error={fields["filter.priceMinCents"]} />
        <TextField label="Highest price" inputMode="decimal" {...form.register("priceMax")} error={fields["filter.priceMaxCents"]} />
        <TextField label="Fewest days in stock" inputMode="numeric" {...form.register("daysMin")} error={fields["filter.daysInStockMin"]} />
        <TextField label="Most days in stock" inputMode="numeric" {...form.register("daysMax")} error={fields["filter.daysInStockMax"]} />
      </div>
      {withColumns ? (
        <ColumnPicker value={draft.columns} onChange={(c) => set("columns", c)} errors={fields} />
      ) : (
        <p className="text-sm text-ink-soft">{draft.format === "json" ? "JSON carries every column of the catalogue for each vehicle." : "JSON-LD carries each vehicle as a schema.org Car with its Offer."}</p>
      )}
      <div className="flex flex-wrap gap-2">
        <Button type="button" tone="secondary" onClick={runPreview} busy={preview.isPending}>
          Preview the first rows
        </Button>
        <Button type="submit" busy={create.isPending}>
          Save the feed
        </Button>
      </div>
      {preview.data ? <PreviewTable preview={preview.data.preview} /> : null}
    </form>
  );
}
