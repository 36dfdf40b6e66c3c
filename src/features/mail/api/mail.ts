import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { get, post } from "../../../lib/api-client.ts";

/** One row of GET /api/mail/outbox (the route selects these columns by name; dates arrive as ISO strings). */
export interface OutboxRow {
  id: number;
  to: string;
  subject: string;
  kind: string;
  status: "pending" | "sent" | "failed";
  attempts: number;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
}

/** What the demo mail catcher received (captured_mail). */
export interface CapturedMail {
  id: number;
  fromAddress: string;
  toAddress: string;
  subject: string;
  text: string;
  html: string;
  receivedAt: string;
}

export const mailKeys = {
  all: ["mail"] as const,
  outbox: () => [...mailKeys.all, "outbox"] as const,
  captured: () => [...mailKeys.all, "captured"] as const,
  capturedOne: (id: number) => [...mailKeys.captured(), id] as const,
};

export const outboxQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.outbox(), queryFn: () => get<{ outbox: OutboxRow[]; demo: boolean }>("/api/mail/outbox") });

export const capturedQueryOptions = () =>
  queryOptions({ queryKey: mailKeys.captured(), queryFn: () => get<{ mail: CapturedMail[] }>("/api/mail/captured") });

export const capturedMailQueryOptions = (id: number) =>
  queryOptions({ queryKey: mailKeys.capturedOne(id), queryFn: () => get<{ mail: CapturedMail }>(`/api/mail/captured/${id}`) });

export const useOutbox = () => useQuery(outboxQueryOptions());
export const useCaptured = (enabled: boolean) => useQuery({ ...capturedQueryOptions(), enabled });
export const useCapturedMail = (id: number | null) => useQuery({ ...capturedMailQueryOptions(id ?? 0), enabled: id !== null });

export function useRetryOutbox() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => post<{ ok: true }>("/api/mail/outbox/retry"),
    onSettled: () => qc.invalidateQueries({ queryKey: mailKeys.all }),
  });
}
