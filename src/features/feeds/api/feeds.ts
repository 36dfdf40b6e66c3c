import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { del, get, post } from "../../../lib/api-client.ts";
import type { CreateFeedInput, PreviewFeedInput } from "../../../../shared/schemas/feeds.ts";
import type { FeedPreview, FeedView } from "../../../../server/modules/feeds/feeds.presenter.ts";

export type { FeedPreview, FeedView };
export type FeedWithUrl = FeedView & { url: string };

export const feedKeys = {
  all: ["feeds"] as const,
  lists: () => [...feedKeys.all, "list"] as const,
};

// The fetch log matters while marketing watches a portal start polling, so the list refreshes itself.
export const feedsQueryOptions = () =>
  queryOptions({ queryKey: feedKeys.lists(), queryFn: () => get<{ feeds: FeedView[] }>("/api/feeds"), refetchInterval: 30_000 });

export const useFeeds = () => useQuery(feedsQueryOptions());

export function useCreateFeed() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateFeedInput) => post<{ feed: FeedWithUrl; url: string }>("/api/feeds", input),
    onSuccess: () => qc.invalidateQueries({ queryKey: feedKeys.lists() }),
  });
}

export const usePreviewFeed = () => useMutation({ mutationFn: (input: PreviewFeedInput) => post<{ preview: FeedPreview }>("/api/feeds/preview", input) });

export function useRotateFeed() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => post<{ feed: FeedWithUrl; url: string }>(`/api/feeds/${id}/rotate`),
    onSettled: () => qc.invalidateQueries({ queryKey: feedKeys.lists() }),
  });
}

export function useRevokeFeed() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => del<void>(`/api/feeds/${id}`),
    onSettled: () => qc.invalidateQueries({ queryKey: feedKeys.lists() }),
  });
}

export const downloadUrl = (id: number) => `/api/feeds/${id}/download`;
