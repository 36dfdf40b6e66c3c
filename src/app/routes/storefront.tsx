import { useQuery } from "@tanstack/react-query";
import { publicDealershipQueryOptions } from "../../features/settings/api/dealership.ts";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";

/** The public front page: the dealership's live stock. */
export default function Storefront() {
  const dealership = useQuery(publicDealershipQueryOptions());
  if (dealership.isPending) return <Loading />;
  if (dealership.isError) {
    return (
      <main className="mx-auto max-w-3xl px-5 py-12">
        <Notice tone="danger" title="This site could not load">
          {dealership.error.message}
        </Notice>
      </main>
    );
  }
  const d = dealership.data.dealership;
  return (
    <div className="min-h-dvh">
      <header className="border-b border-line bg-paper-raised">
        <div className="mx-auto flex max-w-6xl flex-wrap items-baseline justify-between gap-2 px-5 py-5">
          <h1 className="text-2xl font-bold">{d.name}</h1>
          <p className="text-sm text-ink-soft">
            {[d.addressLine, d.town, d.region].filter(Boolean).join(", ")}
            {d.phone ? <> · <a href={`tel:${d.phone.replace(/\s+/g, "")}`}>{d.phone}</a></> : null}
          </p>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-5 py-10">
        <h2 className="text-xl font-bold">Vehicles for sale</h2>
        <div className="mt-6 rounded-lg border border-dashed border-line-strong bg-paper-raised px-6 py-12 text-center">
          <p className="text-lg font-bold">No vehicles are listed right now</p>
          <p className="mx-auto mt-2 max-w-prose text-ink-soft">
            Every car we list comes with a condition report: photos, each mark we found, tyre measurements and checks.
            {d.phone ? ` Call us on ${d.phone} to ask what's arriving.` : ""}
          </p>
        </div>
      </main>
      <footer className="border-t border-line">
        <div className="mx-auto max-w-6xl px-5 py-6 text-sm text-ink-soft">
          {d.name}
          {d.licenceNumber ? ` · Dealer licence ${d.licenceNumber}` : ""} · <a href="/sign-in">Staff sign-in</a>
        </div>
      </footer>
    </div>
  );
}
