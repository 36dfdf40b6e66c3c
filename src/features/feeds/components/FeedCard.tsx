import { useState } from "react";
import { Button } from "../../../components/ui/Button.tsx";
import { Notice } from "../../../components/feedback/Notice.tsx";
import { downloadUrl, useRevokeFeed, useRotateFeed, type FeedView } from "../api/feeds.ts";
import { ago, bytes, filterSummary, formatLabel } from "./format.ts";

function Confirm({ question, yes, onYes, onNo, busy }: { question: string; yes: string; onYes: () => void; onNo: () => void; busy: boolean }) {
  return (
    <div role="group" aria-label={question} className="flex flex-wrap items-center gap-2 rounded-md border border-brick bg-brick-wash px-3 py-2">
      <span className="text-sm font-bold">{question}</span>
      <Button type="button" tone="danger" onClick={onYes} busy={busy}>
        {yes}
      </Button>
      <Button type="button" tone="secondary" onClick={onNo}>
        Keep it
      </Button>
    </div>
  );
}

export function FeedCard({ feed, onSecret }: { feed: FeedView; onSecret: (url: string) => void }) {
  const [asking, setAsking] = useState<null | "rotate" | "revoke">(null);
  const rotate = useRotateFeed();
  const revoke = useRevokeFeed();
  return (
    <article aria-label={`Feed ${feed.name}`} className="rounded-lg border border-line bg-paper-raised p-5">
      <header className="flex flex-wrap items-baseline justify-between gap-3">
        <div>
          <h3 className="text-lg font-bold">{feed.name}</h3>
          <p className="text-sm text-ink-soft">
            {formatLabel(feed.format)} · {feed.units === "metric" ? "metric units" : "the market's units"} · {filterSummary(feed.filter)}
          </p>
          <p className="mt-1 font-mono text-xs text-ink-soft">{feed.urlHint}</p>
        </div>
        <div className="flex flex-wrap gap-2">
          <a href={downloadUrl(feed.id)} className="inline-flex min-h-11 items-center rounded-md border border-line-strong px-4 font-bold text-ink no-underline hover:border-ink-soft" download>
            Download
          </a>
          <Button type="button" tone="secondary" onClick={() => setAsking("rotate")}>
            Rotate URL
          </Button>
          <Button type="button" tone="danger" onClick={() => setAsking("revoke")}>
            Revoke
          </Button>
        </div>
      </header>
      {asking === "rotate" ? (
        <div className="mt-3">
          <Confirm
            question="Rotate the URL? The portal's current URL stops working at once."
            yes="Yes, rotate"
            busy={rotate.isPending}
            onNo={() => setAsking(null)}
            onYes={() => rotate.mutate(feed.id, { onSuccess: ({ url }) => { setAsking(null); onSecret(url); } })}
          />
        </div>
      ) : null}
      {asking === "revoke" ? (
        <div className="mt-3">
          <Confirm question="Revoke this feed for good? Its URL stops working and it leaves this list." yes="Yes, revoke" busy={revoke.isPending} onNo={() => setAsking(null)} onYes={() => revoke.mutate(feed.id)} />
        </div>
      ) : null}
      <div className="mt-3">
        {feed.notFetchedForADay ? (
          <Notice tone="caution" title={feed.lastFetchedAt ? `Not fetched for a day: last fetched ${ago(feed.lastFetchedAt)}` : "Not fetched for a day: never fetched yet"}>
            Check that the portal has the current URL and is polling it.
          </Notice>
        ) : (
          <p className="text-sm">{feed.lastFetchedAt ? `Last fetched ${ago(feed.lastFetchedAt)}.` : "Not fetched yet."}</p>
        )}
      </div>
      <details className="mt-3" open={feed.fetches.length > 0}>
        <summary className="cursor-pointer text-sm font-bold text-signal">{feed.fetches.length ? `Last fetches (${feed.fetches.length}${feed.fetches.length === 20 ? ", the newest 20" : ""})` : "Fetches"}</summary>
        {feed.fetches.length ? (
          <div className="mt-2 overflow-x-auto">
            <table className="min-w-full text-sm tabular-nums" aria-label={`Fetches of ${feed.name}`}>
              <thead className="text-left text-ink-soft">
                <tr>
                  <th className="px-2 py-1">When</th>
                  <th className="px-2 py-1">Address</th>
                  <th className="px-2 py-1">User agent</th>
                  <th className="px-2 py-1 text-right">Rows</th>
                  <th className="px-2 py-1 text-right">Size</th>
                  <th className="px-2 py-1">Answer</th>
                  <th className="px-2 py-1">Since</th>
                </tr>
              </thead>
              <tbody>
                {feed.fetches.map((f) => (
                  <tr key={f.id} className="border-t border-line">
                    <td className="px-2 py-1 whitespace-nowrap" title={f.at}>{new Date(f.at).toLocaleString()}</td>
                    <td className="px-2 py-1 font-mono">{f.ip ?? "—"}</td>
                    <td className="max-w-64 truncate px-2 py-1" title={f.userAgent ?? ""}>{f.userAgent ?? "—"}</td>
                    <td className="px-2 py-1 text-right">{f.rows}</td>
                    <td className="px-2 py-1 text-right">{bytes(f.bytes)}</td>
                    <td className="px-2 py-1">{f.status === 304 ? "not modified" : f.status === 200 ? "sent" : "cut short"}</td>
                    <td className="px-2 py-1">{f.since ? new Date(f.since).toLocaleString() : "whole feed"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : (
          <p className="mt-2 text-sm text-ink-soft">No fetches yet.</p>
        )}
      </details>
    </article>
  );
}
