import type { ConversationItem } from "../api/leads.ts";
import { MAIL_STATUS_WORDS, formatWhen } from "../format.ts";

const KIND_WORDS: Record<ConversationItem["kind"], string> = {
  enquiry: "Enquiry from the buyer",
  note: "Note",
  status: "Status changed",
  mail_out: "E-mail to the buyer",
};

const marker: Record<ConversationItem["kind"], string> = {
  enquiry: "border-signal bg-signal-wash",
  note: "border-line-strong bg-paper-raised",
  status: "border-line-strong bg-paper-sunk",
  mail_out: "border-signal bg-paper-raised",
};

/** The lead's story in order: the enquiry, notes, status moves and mails with their delivery state in words. */
export function Conversation({ items }: { items: ConversationItem[] }) {
  return (
    <ol className="relative flex flex-col gap-4 border-l border-line pl-5" aria-label="Conversation, oldest first">
      {items.map((c) => (
        <li key={c.id} className="relative">
          <span aria-hidden className={`absolute -left-[1.72rem] top-1.5 size-3 rounded-full border-2 ${marker[c.kind]}`} />
          <p className="flex flex-wrap items-baseline gap-x-2 text-sm">
            <span className="font-bold">{KIND_WORDS[c.kind]}</span>
            {c.by ? <span className="text-ink-soft">by {c.by}</span> : null}
            <time dateTime={c.at} className="figures text-ink-soft">
              {formatWhen(c.at)}
            </time>
            {c.mailStatus ? (
              <span className={`rounded-sm border px-1.5 text-xs font-bold ${c.mailStatus === "failed" ? "border-brick text-brick" : c.mailStatus === "sent" ? "border-signal text-signal-strong" : "border-line-strong text-ink-soft"}`}>
                {MAIL_STATUS_WORDS[c.mailStatus as keyof typeof MAIL_STATUS_WORDS] ?? c.mailStatus}
              </span>
            ) : null}
          </p>
          <p className={`mt-1 whitespace-pre-wrap ${c.kind === "status" ? "text-ink-soft" : ""}`}>{c.body}</p>
        </li>
      ))}
    </ol>
  );
}
