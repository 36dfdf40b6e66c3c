import { Link } from "react-router";
import type { LeadRow } from "../api/leads.ts";
import { CONTACT_LABELS } from "../../../../shared/constants/leads.ts";
import { ageWords, followUpState } from "../format.ts";
import { useDealershipDay } from "../../settings/api/dealership.ts";
import { DataTable, type Column } from "../../../components/ui/DataTable.tsx";

const COLUMNS: Column[] = [
  { label: "Status" },
  { label: "Buyer" },
  { label: "Vehicle" },
  { label: "Age", end: true },
  { label: "Assigned to" },
  { label: "Follow up" },
  { label: "Prefers" },
];

export function LeadsTable({ leads, selfId }: { leads: LeadRow[]; selfId: string }) {
  const today = useDealershipDay();
  return (
    <DataTable caption="Enquiries from buyers, open ones first" columns={COLUMNS}>
      {leads.map((l) => {
        const due = followUpState(l.followUpOn, today);
        return (
          <tr key={l.id} className="border-b border-line last:border-0 align-top">
            <td className="px-4 py-3">{l.statusLabel}</td>
            <th scope="row" className="px-4 py-3 font-bold">
              <Link to={`/app/leads/${l.id}`}>{l.name}</Link>
            </th>
            <td className="px-4 py-3">
              {l.vehicle ? (
                <Link to={`/app/vehicles/${l.vehicleId}`} className="text-ink no-underline hover:underline">
                  {l.vehicle.title}
                  <span className="block font-mono text-xs text-ink-soft">Stock {l.vehicle.stockNumber}</span>
                </Link>
              ) : (
                <Link to={`/app/vehicles/${l.vehicleId}`}>Vehicle {l.vehicleId}</Link>
              )}
            </td>
            <td className="px-4 py-3 text-right figures whitespace-nowrap">{ageWords(l.ageDays)}</td>
            <td className="px-4 py-3">{l.assigneeId ? (l.assigneeId === selfId ? "You" : l.assigneeName ?? "Someone") : <span className="text-ink-soft">Unassigned</span>}</td>
            <td className={`px-4 py-3 figures whitespace-nowrap ${due.word === "overdue" ? "font-bold text-brick" : due.word === "today" ? "font-bold" : due.word === "none" ? "text-ink-soft" : ""}`}>
              {due.text}
            </td>
            <td className="px-4 py-3">{CONTACT_LABELS[l.preferredContact]}</td>
          </tr>
        );
      })}
    </DataTable>
  );
}
