import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, patch, post } from "../../../lib/api-client.ts";
import type { UpdateLeadInput } from "../../../../shared/schemas/enquiries.ts";
import type { LeadStatus } from "../../../../shared/constants/leads.ts";
import type { ConversationItem, LeadCounts, LeadDetail, LeadView } from "../../../../server/modules/leads/leads.presenter.ts";

export type { ConversationItem, LeadDetail };
/** A row of the inbox. */
export type LeadRow = LeadView;
/** Marketing's counts per vehicle and per source. */
export type LeadStats = LeadCounts;

/** The inbox filters as the URL carries them (assignee in the screen's words; the API's me/none are mapped here). */
export interface LeadFilters {
  status?: LeadStatus;
  assignee?: "mine" | "unassigned";
  due?: "overdue" | "today";
  q?: string;
}

export const leadKeys = {
  all: ["leads"] as const,
  lists: () => [...leadKeys.all, "list"] as const,
  list: (filters: LeadFilters) => [...leadKeys.lists(), filters] as const,
  details: () => [...leadKeys.all, "detail"] as const,
  detail: (id: number) => [...leadKeys.details(), id] as const,
  stats: () => [...leadKeys.all, "stats"] as const,
};

const toSearch = (f: LeadFilters) => {
  const s = new URLSearchParams();
  if (f.status) s.set("status", f.status);
  if (f.assignee === "mine") s.set("assignee", "me");
  if (f.assignee === "unassigned") s.set("assignee", "none");
  if (f.due) s.set("due", f.due);
  if (f.q) s.set("q", f.q);
  return s.toString();
};

export const leadListQueryOptions = (filters: LeadFilters) =>
  queryOptions({
    queryKey: leadKeys.list(filters),
    queryFn: () => get<{ leads: LeadRow[] }>(`/api/leads?${toSearch(filters)}`),
    placeholderData: keepPreviousData,
  });

export const leadQueryOptions = (id: number) =>
  queryOptions({
    queryKey: leadKeys.detail(id),
    queryFn: () => get<{ lead: LeadDetail }>(`/api/leads/${id}`),
    // While a reply waits in the outbox, look again now and then so its delivery state moves on by itself.
    refetchInterval: (q) => (q.state.data?.lead.conversation.some((c) => c.mailStatus === "queued") ? 4000 : false),
  });

export const leadStatsQueryOptions = () => queryOptions({ queryKey: leadKeys.stats(), queryFn: () => get<LeadStats>("/api/leads/stats") });

export const useLeadList = (filters: LeadFilters) => useQuery(leadListQueryOptions(filters));
export const useLead = (id: number) => useQuery(leadQueryOptions(id));
export const useLeadStats = () => useQuery(leadStatsQueryOptions());

function useLeadWrite<I>(fn: (input: I) => Promise<{ lead: LeadDetail }>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: ({ lead }) => {
      qc.setQueryData(leadKeys.detail(lead.id), { lead });
      void qc.invalidateQueries({ queryKey: leadKeys.lists() });
      void qc.invalidateQueries({ queryKey: leadKeys.stats() });
    },
  });
}

export const useUpdateLead = (id: number) => useLeadWrite((input: UpdateLeadInput) => patch<{ lead: LeadDetail }>(`/api/leads/${id}`, input));
export const useReplyToLead = (id: number) => useLeadWrite((input: { body: string }) => post<{ lead: LeadDetail }>(`/api/leads/${id}/messages`, input));

export function useShareVehicle(vehicleId: number) {
  return useMutation({
    mutationFn: (input: { email: string; name: string; message: string }) => post<{ queued: true }>(`/api/vehicles/${vehicleId}/share`, input),
  });
}
