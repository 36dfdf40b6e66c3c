import { useState } from "react";
import { useCaptured, useCapturedMail } from "../api/mail.ts";
import { EmptyState, Loading, Notice } from "../../../components/feedback/Notice.tsx";

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });

/** Demo mode only: what the local mail catcher received, with the HTML shown in a sandbox that runs nothing. */
export function CapturedMail() {
  const list = useCaptured(true);
  const [openId, setOpenId] = useState<number | null>(null);
  const [view, setView] = useState<"html" | "text">("html");
  const one = useCapturedMail(openId);

  if (list.isPending) return <Loading label="Loading captured mail…" />;
  if (list.isError) return <Notice tone="danger" title="Captured mail could not be loaded">{list.error.message}</Notice>;
  if (!list.data.mail.length) return <EmptyState title="Nothing captured yet">Mail the demo sends (enquiries, replies, invitations) appears here a moment after it leaves the outbox.</EmptyState>;

  const m = one.data?.mail;
  return (
    <div className="grid gap-4 lg:grid-cols-[minmax(16rem,1fr)_2fr]">
      <ul className="flex flex-col divide-y divide-line overflow-hidden rounded-lg border border-line bg-paper-raised" aria-label="Captured mails, newest first">
        {list.data.mail.map((c) => (
          <li key={c.id}>
            <button
              type="button"
              aria-pressed={openId === c.id}
              onClick={() => setOpenId(c.id)}
              className={`block min-h-11 w-full px-4 py-3 text-left ${openId === c.id ? "bg-signal-wash shadow-[inset_3px_0_0_var(--color-signal)]" : "hover:bg-paper-sunk"}`}
            >
              <span className="block font-bold">{c.subject || "(no subject)"}</span>
              <span className="block truncate font-mono text-xs text-ink-soft">To {c.toAddress}</span>
              <span className="block text-xs text-ink-soft figures">{when(c.receivedAt)}</span>
            </button>
          </li>
        ))}
      </ul>
      <section aria-label="Captured mail" className="min-w-0 rounded-lg border border-line bg-paper-raised p-5">
        {openId === null ? (
          <p className="text-ink-soft">Choose a mail to read it as the recipient would.</p>
        ) : one.isPending ? (
          <Loading />
        ) : one.isError ? (
          <Notice tone="danger" title="That mail could not be loaded">{one.error.message}</Notice>
        ) : m ? (
          <>
            <h3 className="text-lg font-bold">{m.subject}</h3>
            <dl className="mt-2 grid grid-cols-[max-content_1fr] gap-x-4 text-sm">
              <dt className="text-ink-soft">From</dt>
              <dd className="font-mono break-all">{m.fromAddress}</dd>
              <dt className="text-ink-soft">To</dt>
              <dd className="font-mono break-all">{m.toAddress}</dd>
              <dt className="text-ink-soft">Received</dt>
              <dd className="figures">{when(m.receivedAt)}</dd>
            </dl>
            <div className="mt-4 flex gap-2" role="group" aria-label="Show as">
              {(["html", "text"] as const).map((k) => (
                <button
                  key={k}
                  type="button"
                  aria-pressed={view === k}
                  onClick={() => setView(k)}
                  className={`min-h-11 rounded-md border px-3 font-bold ${view === k ? "border-signal bg-signal-wash text-ink" : "border-line-strong text-ink-soft"}`}
                >
                  {k === "html" ? "As HTML" : "Plain text"}
                </button>
              ))}
            </div>
            {view === "html" && m.html ? (
              <iframe title={`HTML of “${m.subject}”`} sandbox="" src={`/api/mail/captured/${m.id}/html`} className="mt-3 h-[32rem] w-full rounded-md border border-line bg-white" />
            ) : (
              <pre className="mt-3 max-h-[32rem] overflow-auto whitespace-pre-wrap rounded-md border border-line bg-paper p-4 font-mono text-sm">{m.text || "(no plain-text part)"}</pre>
            )}
          </>
        ) : null}
      </section>
    </div>
  );
}
