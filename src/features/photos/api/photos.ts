import { queryOptions, useIsFetching, useMutation, useQuery, useQueryClient, type QueryClient } from "@tanstack/react-query";
import { ApiError, del, get, isApiError, patch, put } from "../../../lib/api-client.ts";
import { vehicleKeys } from "../../vehicles/api/vehicles.ts";
import type { PhotoView, UploadResult } from "../../../../server/modules/photos/photos.presenter.ts";

export type { PhotoView };

interface PhotoList {
  photos: PhotoView[];
}

const processing = (photos: readonly PhotoView[] | undefined) => new Set((photos ?? []).filter((p) => p.status === "processing").map((p) => p.id));

/**
 * Readiness counts the photos still being processed ("Photos processed"), so when one stops being (its sizes are
 * made, it failed, or it went) the detail's readiness is re-read. Called with every new photo list.
 */
function rereadReadinessWhenFinished(client: QueryClient, vehicleId: number, next: readonly PhotoView[]) {
  const before = processing(client.getQueryData<PhotoList>(vehicleKeys.photos(vehicleId))?.photos);
  const still = processing(next);
  if ([...before].some((id) => !still.has(id))) void client.invalidateQueries({ queryKey: vehicleKeys.detail(vehicleId) });
}

/**
 * A list read while a photo was being edited can arrive after the edit's answer: a photo the cache already holds at
 * a newer version is kept, so a slow poll never puts back the zone or caption just saved (nor its old version, which
 * would make the next edit a conflict).
 */
function keepNewer(client: QueryClient, vehicleId: number, next: PhotoView[]): PhotoView[] {
  const held = new Map((client.getQueryData<PhotoList>(vehicleKeys.photos(vehicleId))?.photos ?? []).map((p) => [p.id, p]));
  return next.map((p) => {
    const mine = held.get(p.id);
    return mine && mine.version > p.version ? mine : p;
  });
}

/** Photos read elsewhere (the evidence answer carries them) enter the one photo cache here. */
export function putPhotos(client: QueryClient, vehicleId: number, photos: PhotoView[]) {
  const merged = keepNewer(client, vehicleId, photos);
  rereadReadinessWhenFinished(client, vehicleId, merged);
  client.setQueryData<PhotoList>(vehicleKeys.photos(vehicleId), { photos: merged });
}

export const photosQueryOptions = (vehicleId: number) =>
  queryOptions({
    queryKey: vehicleKeys.photos(vehicleId),
    queryFn: async ({ client }) => {
      const data = await get<PhotoList>(`/api/vehicles/${vehicleId}/photos`);
      const photos = keepNewer(client, vehicleId, data.photos);
      rereadReadinessWhenFinished(client, vehicleId, photos);
      return { photos };
    },
    // Re-read while any photo is still being processed, so it turns ready by itself (and readiness with it).
    refetchInterval: (q) => (q.state.data?.photos.some((p) => p.status === "processing") ? 1500 : false),
  });

/**
 * The one photo cache, read by the layout, the photos page and the walk-around. The evidence read brings the photos
 * with it, so while that read is under way this one waits instead of asking the server a second time.
 */
export function usePhotos(vehicleId: number) {
  const evidenceLoading = useIsFetching({ queryKey: vehicleKeys.evidence(vehicleId) }) > 0;
  return useQuery({ ...photosQueryOptions(vehicleId), enabled: !evidenceLoading });
}

/** One file per request, over XHR so the page can show its progress and retry it alone. */
export function uploadPhoto(vehicleId: number, file: File, onProgress: (fraction: number) => void, signal?: AbortSignal): Promise<UploadResult> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api/vehicles/${vehicleId}/photos`);
    xhr.setRequestHeader("Accept", "application/json");
    xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded / e.total);
    xhr.onerror = () => reject(new ApiError(0, "network", "The upload was interrupted. Check the connection and retry."));
    xhr.onabort = () => reject(new ApiError(0, "aborted", "Upload cancelled."));
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status >= 200 && xhr.status < 300) return resolve(body as UploadResult);
      const e = (body as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
      reject(new ApiError(xhr.status, e?.code ?? `http_${xhr.status}`, e?.message ?? `The server answered ${xhr.status}.`, e?.fields ?? {}));
    };
    signal?.addEventListener("abort", () => xhr.abort());
    const form = new FormData();
    form.append("photos", file, file.name);
    xhr.send(form);
  });
}

/** After an upload: the photos, and readiness (the count, the cover, photos still processing). */
export function useRefreshPhotos(vehicleId: number) {
  const qc = useQueryClient();
  return () => Promise.all([vehicleKeys.photos(vehicleId), vehicleKeys.detail(vehicleId)].map((queryKey) => qc.invalidateQueries({ queryKey })));
}

/** A caption, zone or cover: the answer replaces that photo in the cache. Readiness is unchanged (a cover is always set). */
export function useUpdatePhoto(vehicleId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ id, ...input }: { id: number; version: number; caption?: string; zone?: string | null; isCover?: true }) => {
      const path = `/api/vehicles/${vehicleId}/photos/${id}`;
      // The photo worker moves a photo's version when its sizes are made. Only that, with caption, zone and cover as the
      // person saw them, leaves the edit theirs to make on the current version; anyone else's edit stays a conflict.
      const seen = qc.getQueryData<PhotoList>(vehicleKeys.photos(vehicleId))?.photos.find((p) => p.id === id);
      const onlyProcessed = (now: PhotoView | undefined): now is PhotoView =>
        !!now && !!seen && now.caption === seen.caption && now.zone === seen.zone && now.isCover === seen.isCover;
      let version = input.version;
      if (seen?.status === "processing") {
        // Still processing as last read: ask for its version first, so the edit is not refused when the sizes are done.
        const now = (await get<PhotoList>(`/api/vehicles/${vehicleId}/photos`)).photos.find((p) => p.id === id);
        if (onlyProcessed(now)) version = now.version;
      }
      try {
        return await patch<{ photo: PhotoView }>(path, { ...input, version });
      } catch (e) {
        // The sizes were finished between that read and the edit.
        const current = isApiError(e) && e.code === "stale_version" ? (e.details.current as PhotoView | undefined) : undefined;
        if (!onlyProcessed(current)) throw e;
        return patch<{ photo: PhotoView }>(path, { ...input, version: current.version });
      }
    },
    // A poll already on its way would answer with the photo as it was; stop it (the next one reads the change).
    onMutate: () => qc.cancelQueries({ queryKey: vehicleKeys.photos(vehicleId) }),
    onSuccess: ({ photo }, input) => {
      const prev = qc.getQueryData<PhotoList>(vehicleKeys.photos(vehicleId));
      // A new cover takes the mark off the old one, as the server does (without a new version for it).
      if (prev) putPhotos(qc, vehicleId, prev.photos.map((p) => (p.id === photo.id ? photo : input.isCover ? { ...p, isCover: false } : p)));
    },
    onError: () => qc.invalidateQueries({ queryKey: vehicleKeys.photos(vehicleId) }),
  });
}

export function useReorderPhotos(vehicleId: number) {
  const qc = useQueryClient();
  const key = vehicleKeys.photos(vehicleId);
  return useMutation({
    mutationFn: (order: number[]) => put<PhotoList>(`/api/vehicles/${vehicleId}/photos/order`, { order }),
    // Show the new order at once; the server's answer (or a reload on conflict) settles it.
    onMutate: (order) => {
      const prev = qc.getQueryData<PhotoList>(key);
      if (prev) qc.setQueryData(key, { photos: order.map((id) => prev.photos.find((p) => p.id === id)).filter((p) => p !== undefined) });
      return { prev };
    },
    onSuccess: ({ photos }) => putPhotos(qc, vehicleId, photos),
    onError: (_e, _o, c) => {
      if (c?.prev) qc.setQueryData(key, c.prev);
      void qc.invalidateQueries({ queryKey: key });
    },
  });
}

/** A deleted photo takes its pins off their defects (the evidence) and counts for readiness. */
export function useDeletePhoto(vehicleId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (p: { id: number; version: number }) => del<void>(`/api/vehicles/${vehicleId}/photos/${p.id}?version=${p.version}`),
    onSettled: () =>
      Promise.all(
        [vehicleKeys.photos(vehicleId), vehicleKeys.evidence(vehicleId), vehicleKeys.detail(vehicleId)].map((queryKey) => qc.invalidateQueries({ queryKey })),
      ),
  });
}
