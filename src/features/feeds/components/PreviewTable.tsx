import type { FeedPreview } from "../api/feeds.ts";

export function PreviewTable({ preview }: { preview: FeedPreview }) {
  return (
    <div className="flex flex-col gap-3">
      <p className="text-sm text-ink-soft">
        {preview.total === 1 ? "1 vehicle matches" : `${preview.total} vehicles match`} now; the first {preview.rows.length} are shown.
      </p>
      <div className="overflow-x-auto rounded-md border border-line">
        <table className="min-w-full text-sm tabular-nums" aria-label="Preview of the first rows">
          <thead className="bg-paper-sunk text-left">
            <tr>
              {preview.columns.map((c) => (
                <th key={c.header} scope="col" className="whitespace-nowrap px-3 py-2 font-bold">
                  {c.header}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {preview.rows.map((r, i) => (
              <tr key={i} className="border-t border-line align-top">
                {r.map((cell, j) => (
                  <td key={j} className="max-w-72 truncate px-3 py-2" title={cell}>
                    {cell === "" ? <span className="text-ink-faint">empty</span> : cell}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <details>
        <summary className="cursor-pointer text-sm font-bold text-signal">The feed's text for the first rows</summary>
        <pre className="mt-2 max-h-72 overflow-auto rounded-md border border-line bg-paper-sunk p-3 font-mono text-xs whitespace-pre-wrap">{preview.sample}</pre>
      </details>
    </div>
  );
}
