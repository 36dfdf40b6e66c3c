import type { FormEvent } from "react";
import { useDraft } from "../../../components/form/use-draft.ts";
import { Button } from "../../../components/ui/Button.tsx";
import { LEAD_STATUSES, LEAD_STATUS_LABELS, type LeadStatus } from "../../../../shared/constants/leads.ts";
import type { LeadFilters } from "../api/leads.ts";

const select = "min-h-11 rounded-md border border-line-strong bg-paper-raised px-2 text-base";

/** Filters that live in the URL, so a filtered inbox can be bookmarked and shared. */
export function LeadFiltersBar({ filters, onChange }: { filters: LeadFilters; onChange: (f: LeadFilters) => void }) {
  const [q, setQ] = useDraft(filters.q ?? "", filters.q);
  const search = (e: FormEvent) => {
    e.preventDefault();
    onChange({ ...filters, q: q.trim() || undefined });
  };
  return (
    <form role="search" onSubmit={search} className="mb-4 flex flex-wrap items-end gap-4">
      <label className="flex flex-col gap-1 text-sm font-bold">
        Status
        <select className={select} value={filters.status ?? ""} onChange={(e) => onChange({ ...filters, status: (e.target.value || undefined) as LeadStatus | undefined })}>
          <option value="">Any status</option>
          {LEAD_STATUSES.map((s) => (
            <option key={s} value={s}>
              {LEAD_STATUS_LABELS[s]}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-bold">
        Assigned to
        <select className={select} value={filters.assignee ?? ""} onChange={(e) => onChange({ ...filters, assignee: (e.target.value || undefined) as LeadFilters["assignee"] })}>
          <option value="">Anyone</option>
          <option value="mine">Me</option>
          <option value="unassigned">Nobody yet</option>
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-bold">
        Follow-up
        <select className={select} value={filters.due ?? ""} onChange={(e) => onChange({ ...filters, due: (e.target.value || undefined) as LeadFilters["due"] })}>
          <option value="">Any date</option>
          <option value="overdue">Overdue</option>
          <option value="today">Due today</option>
        </select>
      </label>
      <div className="flex items-end gap-2">
        <label className="flex flex-col gap-1 text-sm font-bold">
          Search enquiries
          <input
            type="search"
            className={`${select} w-64 px-3`}
            value={q}
            onChange={(e) => setQ(e.target.value)}
            placeholder="Name, e-mail or phone"
            maxLength={80}
          />
        </label>
        <Button type="submit" tone="secondary">
          Search
        </Button>
      </div>
    </form>
  );
}
