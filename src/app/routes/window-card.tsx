import { useParams } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "../../lib/api-client.ts";
import { publicVehicleQueryOptions, storefrontDealershipQueryOptions, withdrawnDealership } from "../../features/storefront/api/storefront.ts";
import { WindowCard } from "../../features/storefront/components/WindowCard.tsx";
import { LoadFailed, NotFound, PageLoading, Withdrawn } from "../../features/storefront/components/PublicStates.tsx";
import { useDocumentTitle } from "../../features/storefront/components/useDocumentTitle.ts";
import { useScrollTopOnOpen } from "../../features/storefront/components/useScrollTopOnOpen.ts";
import "../../print.css";

/** /vehicles/:slug/card — the printable window card of the current revision, with the QR code to the page. */
export default function WindowCardRoute() {
  const { slug = "" } = useParams();
  const current = useQuery(publicVehicleQueryOptions(slug));
  useScrollTopOnOpen(slug);
  const failed = current.isError ? current.error : null;
  const status = isApiError(failed) ? failed.status : null;
  const dealershipQuery = useQuery({ ...storefrontDealershipQueryOptions(), enabled: !!failed && !withdrawnDealership(failed) });
  const dealership = withdrawnDealership(failed) ?? dealershipQuery.data?.dealership ?? null;
  const vehicle = current.data?.vehicle ?? null;
  useDocumentTitle(vehicle ? `Window card: ${vehicle.snapshot.title} — ${vehicle.snapshot.dealership.name}` : "Window card");

  if (vehicle) return <WindowCard vehicle={vehicle} />;
  if (current.isPending) return <PageLoading label="Loading the window card…" />;
  if (status === 410) return <Withdrawn dealership={dealership} />;
  if (status === 404) return <NotFound dealership={dealership} />;
  return <LoadFailed dealership={dealership} message={failed?.message ?? "Something went wrong."} onRetry={() => void current.refetch()} />;
}
