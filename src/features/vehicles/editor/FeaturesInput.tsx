import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { suggestionsQueryOptions } from "../api/vehicles.ts";

/** Feature tags, with suggestions from this dealership's earlier vehicles. */
export function FeaturesInput({ value, onChange, disabled, error }: { value: string[]; onChange: (v: string[]) => void; disabled: boolean; error?: string }) {
  const [text, setText] = useState("");
  const suggestions = useQuery({ ...suggestionsQueryOptions(text.trim()), enabled: !disabled });
  const add = (tag: string) => {
    const t = tag.trim();
    if (t && !value.some((v) => v.toLowerCase() === t.toLowerCase())) onChange([...value, t]);
    setText("");
  };
  const offered = (suggestions.data?.features ?? []).filter((f) => !value.some((v) => v.toLowerCase() === f.toLowerCase())).slice(0, 8);
  return (
    <div className="flex flex-col gap-2">
      <span className="text-sm font-bold" id="features-label">Features</span>
      <ul className="flex flex-wrap gap-2" aria-labelledby="features-label">
        {value.map((f) => (
          <li key={f} className="inline-flex items-center gap-1 rounded-sm border border-line-strong bg-paper px-2 py-1 text-sm">
            {f}
            {!disabled ? (
              <button type="button" aria-label={`Remove ${f}`} className="ml-1 size-6 rounded-sm text-ink-soft hover:bg-brick-wash hover:text-brick" onClick={() => onChange(value.filter((v) => v !== f))}>
                ×
              </button>
            ) : null}
          </li>
        ))}
        {value.length === 0 ? <li className="text-sm text-ink-soft">None listed.</li> : null}
      </ul>
      {!disabled ? (
        <>
          <div className="flex gap-2">
            <label htmlFor="feature-new" className="sr-only">Add a feature</label>
            <input
              id="feature-new"
              className="min-h-11 flex-1 rounded-md border border-line-strong bg-paper-raised px-3"
              placeholder="Type a feature and press Enter"
              value={text}
              maxLength={40}
              onChange={(e) => setText(e.target.value)}
              onKeyDown={(e) => {
                if (e.key === "Enter" || e.key === ",") {
                  e.preventDefault();
                  add(text);
                }
              }}
            />
            <button type="button" className="min-h-11 rounded-md border border-line-strong px-3 font-bold" onClick={() => add(text)}>Add</button>
          </div>
          {offered.length ? (
            <div className="flex flex-wrap items-center gap-2 text-sm">
              <span className="text-ink-soft">Used before:</span>
              {offered.map((f) => (
                <button key={f} type="button" className="min-h-9 rounded-sm border border-dashed border-line-strong px-2 hover:border-signal" onClick={() => add(f)}>
                  + {f}
                </button>
              ))}
            </div>
          ) : null}
        </>
      ) : null}
      {error ? <p className="text-sm font-bold text-brick">{error}</p> : null}
    </div>
  );
}
