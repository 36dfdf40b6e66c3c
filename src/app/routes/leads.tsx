import { useSearchParams } from "react-router";
import { RequireAction, useStaffUser } from "../RequireAction.tsx";
import { useLeadList, useLeadStats, type LeadFilters } from "../../features/leads/api/leads.ts";
import { LeadsTable } from "../../features/leads/components/LeadsTable.tsx";
import { LeadFiltersBar } from "../../features/leads/components/LeadFiltersBar.tsx";
import { LeadStatsView } from "../../features/leads/components/LeadStatsView.tsx";
import { PageHeader } from "../../components/ui/Page.tsx";
import { EmptyState, Loading, Notice } from "../../components/feedback/Notice.tsx";
import { LEAD_STATUSES, type LeadStatus } from "../../../shared/constants/leads.ts";
import { can } from "../../../shared/permissions.ts";

const pick = <T extends string>(v: string | null, allowed: readonly T[]) => (v && (allowed as readonly string[]).includes(v) ? (v as T) : undefined);

function filtersFrom(params: URLSearchParams): LeadFilters {
  return {
    status: pick<LeadStatus>(params.get("status"), LEAD_STATUSES),
    assignee: pick(params.get("assignee"), ["mine", "unassigned"] as const),
    due: pick(params.get("due"), ["overdue", "today"] as const),
    q: params.get("q")?.trim().slice(0, 80) || undefined,
  };
}

function Inbox() {
  const me = useStaffUser();
  const [params, setParams] = useSearchParams();
  const filters = filtersFrom(params);
  const list = useLeadList(filters);
  const filtered = Boolean(filters.status || filters.assignee || filters.due || filters.q);

  const change = (f: LeadFilters) => {
    const next = new URLSearchParams();
    for (const [k, v] of Object.entries(f)) if (typeof v === "string" && v) next.set(k, v);
    setParams(next);
  };

  return (
    <>
      <PageHeader title="Enquiries" lead="Buyers' questions from the condition pages, open ones first. Reply the same working day; set a follow-up date so nobody waits." />
      <LeadFiltersBar filters={filters} onChange={change} />
      {list.isPending ? (
        <Loading label="Loading enquiries…" />
      ) : list.isError ? (
        <Notice tone="danger" title="The enquiries could not be loaded">{list.error.message}</Notice>
      ) : list.data.leads.length === 0 ? (
        filtered ? (
          <EmptyState title="No enquiries match these filters">
            <button type="button" className="min-h-11 font-bold text-signal underline" onClick={() => setParams(new URLSearchParams())}>
              Show every enquiry
            </button>
          </EmptyState>
        ) : (
          <EmptyState title="No enquiries yet">When a buyer asks about a vehicle on its condition page, the question appears here and the salesperson gets an e-mail.</EmptyState>
        )
      ) : (
        <>
          <p className="mb-2 text-sm text-ink-soft" aria-live="polite">
            {list.data.leads.length === 1 ? "1 lead" : `${list.data.leads.length} leads`}
            {list.data.leads.length === 50 ? " (the first 50; narrow the filters to see others)" : ""}
          </p>
          <LeadsTable leads={list.data.leads} selfId={me.id} />
        </>
      )}
    </>
  );
}

function Counts() {
  const stats = useLeadStats();
  return (
    <>
      <PageHeader title="Enquiry counts" lead="How many questions each vehicle draws, and from where. Buyers' details stay with sales." />
      {stats.isPending ? <Loading /> : stats.isError ? <Notice tone="danger" title="The counts could not be loaded">{stats.error.message}</Notice> : <LeadStatsView stats={stats.data} />}
    </>
  );
}

export default function LeadsRoute() {
  const me = useStaffUser();
  return <RequireAction action="leads.stats">{can(me, "leads.read") ? <Inbox /> : <Counts />}</RequireAction>;
}
