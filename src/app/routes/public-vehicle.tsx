import { useParams, useSearchParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "../../lib/api-client.ts";
import {
  publicRevisionQueryOptions,
  publicVehicleQueryOptions,
  storefrontDealershipQueryOptions,
  withdrawnDealership,
} from "../../features/storefront/api/storefront.ts";
import { ConditionPage } from "../../features/storefront/components/ConditionPage.tsx";
import { LoadFailed, NotFound, PageLoading, Withdrawn } from "../../features/storefront/components/PublicStates.tsx";
import { useDocumentTitle } from "../../features/storefront/components/useDocumentTitle.ts";
import { useScrollTopOnOpen } from "../../features/storefront/components/useScrollTopOnOpen.ts";
import "../../print.css";

const revisionParam = (s: string | null) => (s && /^\d{1,6}$/.test(s) && Number(s) > 0 ? Number(s) : null);

/**
 * /vehicles/:slug — the condition page of the newest revision; `?revision=N` shows an older one exactly as it was
 * published, under a banner pointing to the current report.
 */
export default function PublicVehicleRoute() {
  const { slug = "" } = useParams();
  const [params] = useSearchParams();
  const wanted = revisionParam(params.get("revision"));
  const current = useQuery(publicVehicleQueryOptions(slug));
  const older = useQuery({ ...publicRevisionQueryOptions(slug, wanted ?? 0), enabled: wanted !== null });
  useScrollTopOnOpen(`${slug}/${wanted ?? ""}`);

  const shown = wanted !== null ? older : current;
  const failed = shown.isError ? shown.error : null;
  const status = isApiError(failed) ? failed.status : null;
  const needDealership = !!failed && !(status === 410 && withdrawnDealership(failed));
  const dealershipQuery = useQuery({ ...storefrontDealershipQueryOptions(), enabled: needDealership });
  const dealership = withdrawnDealership(failed) ?? dealershipQuery.data?.dealership ?? null;

  const vehicle = shown.data?.vehicle ?? null;
  const latest = Math.max(vehicle?.revision.number ?? 0, current.data?.vehicle.revision.number ?? 0, ...(vehicle?.revisions ?? []).map((r) => r.number));
  const name = vehicle?.snapshot.dealership.name ?? dealership?.name;
  useDocumentTitle(
    vehicle
      ? `${vehicle.snapshot.title}${vehicle.revision.number < latest ? ` (revision ${vehicle.revision.number})` : ""} — ${vehicle.snapshot.dealership.name}`
      : status === 410
        ? `No longer advertised${name ? ` — ${name}` : ""}`
        : status === 404
          ? `Not found${name ? ` — ${name}` : ""}`
          : (name ?? "Condition report"),
  );

  if (vehicle) return <ConditionPage vehicle={vehicle} latest={latest} />;
  if (shown.isPending) return <PageLoading label="Loading the condition report…" />;
  if (status === 410) return <Withdrawn dealership={dealership} />;
  if (status === 404) return <NotFound dealership={dealership} what={wanted !== null && current.isSuccess ? "revision" : "vehicle"} />;
  return <LoadFailed dealership={dealership} message={failed?.message ?? "Something went wrong."} onRetry={() => void shown.refetch()} />;
}
