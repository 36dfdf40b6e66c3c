import { Link } from "react-router";
import type { LeadRow } from "../api/leads.ts";
import { CONTACT_LABELS } from "../../../../shared/constants/leads.ts";
import { ageWords, followUpState } from "../format.ts";
import { useDealershipDay } from "../../settings/api/dealership.ts";

export function LeadsTable({ leads, selfId }: { leads: LeadRow[]; selfId: string }) {
  const today = useDealershipDay();
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-paper-raised">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Enquiries from buyers, open ones first</caption>
        <thead className="border-b border-line bg-paper-sunk text-xs uppercase tracking-wide text-ink-soft">
          <tr>
            <th scope="col" className="px-4 py-3">Status</th>
            <th scope="col" className="px-4 py-3">Buyer</th>
            <th scope="col" className="px-4 py-3">Vehicle</th>
            <th scope="col" className="px-4 py-3 text-right">Age</th>
            <th scope="col" className="px-4 py-3">Assigned to</th>
            <th scope="col" className="px-4 py-3">Follow up</th>
            <th scope="col" className="px-4 py-3">Prefers</th>
          </tr>
        </thead>
        <tbody>
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
        </tbody>
      </table>
    </div>
  );
}
