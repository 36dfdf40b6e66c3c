import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { ApiError, del, get, patch, put } from "../../../lib/api-client.ts";
import { vehicleKeys } from "../../vehicles/api/vehicles.ts";
import type { PhotoView } from "../../../../server/modules/photos/photos.presenter.ts";

export type { PhotoView };

export const photoKeys = {
  all: ["photos"] as const,
  forVehicle: (vehicleId: number) => [...photoKeys.all, vehicleId] as const,
};

export const photosQueryOptions = (vehicleId: number) =>
  queryOptions({
    queryKey: photoKeys.forVehicle(vehicleId),
    queryFn: () => get<{ photos: PhotoView[] }>(`/api/vehicles/${vehicleId}/photos`),
    // Re-read while any photo is still being processed, so it turns ready by itself.
    refetchInterval: (q) => (q.state.data?.photos.some((p) => p.status === "processing") ? 1500 : false),
  });

export const usePhotos = (vehicleId: number) => useQuery(photosQueryOptions(vehicleId));

export interface UploadResult {
  photos: PhotoView[];
  refused: Array<{ name: string; status: number; reason: string }>;
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

function useRefresh(vehicleId: number) {
  const qc = useQueryClient();
  return () =>
    Promise.all([qc.invalidateQueries({ queryKey: photoKeys.forVehicle(vehicleId) }), qc.invalidateQueries({ queryKey: vehicleKeys.detail(vehicleId) })]);
}

export function useUpdatePhoto(vehicleId: number) {
  const refresh = useRefresh(vehicleId);
  return useMutation({
    mutationFn: ({ id, ...input }: { id: number; version: number; caption?: string; zone?: string | null; isCover?: true }) =>
      patch<{ photo: PhotoView }>(`/api/vehicles/${vehicleId}/photos/${id}`, input),
    onSettled: refresh,
  });
}

export function useReorderPhotos(vehicleId: number) {
  const qc = useQueryClient();
  const refresh = useRefresh(vehicleId);
  return useMutation({
    mutationFn: (order: number[]) => put<{ photos: PhotoView[] }>(`/api/vehicles/${vehicleId}/photos/order`, { order }),
    // Show the new order at once; the server's answer (or a reload on conflict) settles it.
    onMutate: (order) => {
      const key = photoKeys.forVehicle(vehicleId);
      const prev = qc.getQueryData<{ photos: PhotoView[] }>(key);
      if (prev) qc.setQueryData(key, { photos: order.map((id) => prev.photos.find((p) => p.id === id)!).filter(Boolean) });
      return { prev };
    },
    onError: (_e, _o, c) => c?.prev && qc.setQueryData(photoKeys.forVehicle(vehicleId), c.prev),
    onSettled: refresh,
  });
}

export function useDeletePhoto(vehicleId: number) {
  const refresh = useRefresh(vehicleId);
  return useMutation({
    mutationFn: (p: { id: number; version: number }) => del<void>(`/api/vehicles/${vehicleId}/photos/${p.id}?version=${p.version}`),
    onSettled: refresh,
  });
}

export const useRefreshPhotos = useRefresh;
