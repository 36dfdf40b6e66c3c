import type { OutboxRow } from "../api/mail.ts";
import { DataTable, type Column } from "../../../components/ui/DataTable.tsx";

export const KIND_WORDS: Record<string, string> = {
  enquiry_staff: "Enquiry, to staff",
  enquiry_confirmation: "Enquiry copy, to buyer",
  lead_reply: "Reply to a buyer",
  share: "Condition page shared",
  invite: "Staff invitation",
  reset: "Password reset",
};

const STATUS_WORDS: Record<OutboxRow["status"], string> = { pending: "Waiting to send", sent: "Sent", failed: "Failed" };

const COLUMNS: Column[] = [{ label: "To" }, { label: "Subject" }, { label: "Kind" }, { label: "Status" }, { label: "Attempts", end: true }, { label: "Last error" }];

const when = (iso: string | null) => (iso ? new Date(iso).toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" }) : "");

export function OutboxTable({ rows }: { rows: OutboxRow[] }) {
  return (
    <DataTable caption="Mail going out, newest first" columns={COLUMNS}>
      {rows.map((m) => (
        <tr key={m.id} className="border-b border-line last:border-0 align-top">
          <td className="px-4 py-3 font-mono break-all">{m.to}</td>
          <th scope="row" className="px-4 py-3 font-normal">
            {m.subject}
            <span className="block text-xs text-ink-soft figures">Queued {when(m.createdAt)}</span>
          </th>
          <td className="px-4 py-3">{KIND_WORDS[m.kind] ?? m.kind}</td>
          <td className={`px-4 py-3 whitespace-nowrap ${m.status === "failed" ? "font-bold text-brick" : m.status === "pending" ? "font-bold" : ""}`}>
            {STATUS_WORDS[m.status]}
            {m.sentAt ? <span className="block text-xs font-normal text-ink-soft figures">{when(m.sentAt)}</span> : null}
          </td>
          <td className="px-4 py-3 text-right figures">{m.attempts}</td>
          <td className="px-4 py-3 text-ink-soft">{m.lastError ?? "—"}</td>
        </tr>
      ))}
    </DataTable>
  );
}
