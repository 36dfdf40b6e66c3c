import { useState } from "react";
import { COLUMN_GROUP_LABELS, FEED_COLUMNS, columnSpec, type ColumnGroup } from "../../../../shared/schemas/feeds.ts";
import { PHOTO_WIDTHS } from "../../../../shared/constants/evidence.ts";
import { Button } from "../../../components/ui/Button.tsx";

export interface ColumnDraft {
  key: string;
  header: string;
  photoWidth: string;
}

const GROUPS = Object.keys(COLUMN_GROUP_LABELS) as ColumnGroup[];

/** Choose columns, order them with up and down, rename their headers, pick a photo width. */
export function ColumnPicker({ value, onChange, errors }: { value: ColumnDraft[]; onChange: (next: ColumnDraft[]) => void; errors: Record<string, string> }) {
  const [adding, setAdding] = useState("");
  const move = (i: number, by: number) => {
    const next = [...value];
    const [c] = next.splice(i, 1);
    next.splice(i + by, 0, c);
    onChange(next);
  };
  const set = (i: number, patch: Partial<ColumnDraft>) => onChange(value.map((c, k) => (k === i ? { ...c, ...patch } : c)));
  const add = () => {
    const spec = columnSpec(adding);
    if (!spec) return;
    onChange([...value, { key: spec.key, header: spec.key, photoWidth: spec.width ? "1024" : "" }]);
    setAdding("");
  };
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="text-sm font-bold">Columns, in order</legend>
      {errors.columns ? <p className="text-sm font-bold text-brick" role="alert">{errors.columns}</p> : null}
      <ol className="flex flex-col gap-2">
        {value.map((c, i) => {
          const spec = columnSpec(c.key);
          const err = errors[`columns.${i}.header`] ?? errors[`columns.${i}.key`] ?? errors[`columns.${i}.photoWidth`];
          return (
            <li key={`${c.key}-${i}`} className="flex flex-wrap items-center gap-2 rounded-md border border-line bg-paper-raised px-3 py-2">
              <span className="w-6 text-right font-mono text-sm text-ink-soft tabular-nums">{i + 1}</span>
              <span className="w-56 text-sm">{spec?.label ?? c.key}</span>
              <label className="flex items-center gap-2 text-sm">
                <span className="sr-only">Header for {spec?.label ?? c.key}</span>
                <input
                  aria-label={`Header for ${spec?.label ?? c.key}`}
                  value={c.header}
                  onChange={(e) => set(i, { header: e.target.value })}
                  aria-invalid={Boolean(err)}
                  className="min-h-11 w-48 rounded-md border border-line-strong bg-paper-raised px-2 font-mono text-sm aria-[invalid=true]:border-brick"
                />
              </label>
              {spec?.width ? (
                <select aria-label={`Photo width for ${spec.label}`} value={c.photoWidth} onChange={(e) => set(i, { photoWidth: e.target.value })} className="min-h-11 rounded-md border border-line-strong bg-paper-raised px-2 text-sm">
                  {PHOTO_WIDTHS.map((w) => (
                    <option key={w} value={w}>
                      {w} px wide
                    </option>
                  ))}
                </select>
              ) : null}
              <span className="ml-auto flex gap-1">
                <Button type="button" tone="secondary" className="min-w-11 px-2" disabled={i === 0} onClick={() => move(i, -1)} aria-label={`Move ${spec?.label ?? c.key} up`}>
                  ↑
                </Button>
                <Button type="button" tone="secondary" className="min-w-11 px-2" disabled={i === value.length - 1} onClick={() => move(i, 1)} aria-label={`Move ${spec?.label ?? c.key} down`}>
                  ↓
                </Button>
                <Button type="button" tone="quiet" onClick={() => onChange(value.filter((_, k) => k !== i))} aria-label={`Remove ${spec?.label ?? c.key}`}>
                  Remove
                </Button>
              </span>
              {err ? <p className="w-full text-sm font-bold text-brick" role="alert">{err}</p> : null}
            </li>
          );
        })}
      </ol>
      <div className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 text-sm font-bold">
          Add a column
          <select value={adding} onChange={(e) => setAdding(e.target.value)} className="min-h-11 rounded-md border border-line-strong bg-paper-raised px-2 font-normal">
            <option value="">Choose…</option>
            {GROUPS.map((g) => (
              <optgroup key={g} label={COLUMN_GROUP_LABELS[g]}>
                {FEED_COLUMNS.filter((c) => c.group === g).map((c) => (
                  <option key={c.key} value={c.key}>
                    {c.label}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </label>
        <Button type="button" tone="secondary" onClick={add} disabled={!adding}>
          Add
        </Button>
      </div>
    </fieldset>
  );
}
