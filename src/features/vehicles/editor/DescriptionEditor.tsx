import { useMemo, useState } from "react";
import { renderMarkdown } from "../../../../shared/markdown.ts";

export function DescriptionEditor({ value, onChange, disabled, error }: { value: string; onChange: (v: string) => void; disabled: boolean; error?: string }) {
  const [preview, setPreview] = useState(false);
  const html = useMemo(() => (preview ? renderMarkdown(value) : ""), [preview, value]);
  return (
    <div className="flex flex-col gap-2">
      <div className="flex items-center justify-between">
        <label htmlFor="description" className="text-sm font-bold">Listing copy</label>
        <div role="group" aria-label="Edit or preview" className="flex rounded-md border border-line-strong text-sm">
          <button type="button" aria-pressed={!preview} className={`min-h-9 px-3 ${!preview ? "bg-ink text-paper" : ""}`} onClick={() => setPreview(false)}>Write</button>
          <button type="button" aria-pressed={preview} className={`min-h-9 px-3 ${preview ? "bg-ink text-paper" : ""}`} onClick={() => setPreview(true)}>Preview</button>
        </div>
      </div>
      {preview ? (
        // Rendered by the same sanitising function as the public page: raw HTML shows as text, scripts never run.
        <div className="prose-copy min-h-40 rounded-md border border-line bg-paper p-4" dangerouslySetInnerHTML={{ __html: html || "<p><em>Nothing written yet.</em></p>" }} />
      ) : (
        <textarea
          id="description"
          className="min-h-40 w-full rounded-md border border-line-strong bg-paper-raised p-3 aria-[invalid=true]:border-brick"
          value={value}
          disabled={disabled}
          maxLength={20000}
          aria-invalid={Boolean(error)}
          onChange={(e) => onChange(e.target.value)}
        />
      )}
      {error ? <p className="text-sm font-bold text-brick">{error}</p> : null}
    </div>
  );
}
