import { Link, NavLink, Outlet, useOutletContext, useParams } from "react-router";
import { useStaffUser } from "../RequireAction.tsx";
import { can } from "../../../shared/permissions.ts";
import { useDealership, type DealershipView } from "../../features/settings/api/dealership.ts";
import { useVehicle, type VehicleDetail } from "../../features/vehicles/api/vehicles.ts";
import { useVehicleEvidence } from "../../features/vehicles/api/evidence.ts";
import { usePhotos } from "../../features/photos/api/photos.ts";
import { StatusActions } from "../../features/vehicles/components/StatusActions.tsx";
import { StatusBadge } from "../../features/vehicles/components/StatusBadge.tsx";
import { PublishPanel } from "../../features/publishing/components/PublishPanel.tsx";
import { ShareVehicle } from "../../features/leads/components/ShareVehicle.tsx";
import { ConditionSummary } from "../../features/vehicles/components/ConditionSummary.tsx";
import { odometerText, priceText, vehicleTitle } from "../../features/vehicles/format.ts";
import { Panel } from "../../components/ui/Page.tsx";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";
import type { SessionUser } from "../../../shared/schemas/auth.ts";

/** The detail only (record, readiness, publishing): a page that shows evidence or photos reads their own caches. */
export interface VehicleContext {
  vehicle: VehicleDetail;
  dealership: DealershipView;
  user: SessionUser;
}

/** The pages of one vehicle share its header, status and side panel; each reads the vehicle from this context. */
export const useVehicleContext = () => useOutletContext<VehicleContext>();

const TABS = [
  { to: "", label: "Record", end: true },
  { to: "photos", label: "Photos" },
  { to: "walkaround", label: "Walk-around" },
  { to: "checks", label: "Tyres and checks" },
];

export default function VehicleLayout() {
  const { id } = useParams();
  const vehicleId = Number(id);
  const user = useStaffUser();
  // The three reads start together; the page waits for the record only, the panels fill in as the rest arrive.
  const v = useVehicle(vehicleId);
  const evidence = useVehicleEvidence(vehicleId);
  const photos = usePhotos(vehicleId);
  const d = useDealership();
  if (!Number.isInteger(vehicleId)) return <Notice tone="danger" title="That is not a vehicle address." />;
  if (v.isPending || d.isPending) return <Loading label="Loading the vehicle…" />;
  if (v.isError) return <Notice tone="danger" title={v.error.status === 404 ? "That vehicle does not exist, or belongs to another dealership." : v.error.message} />;
  if (d.isError) return <Notice tone="danger" title={d.error.message} />;
  const vehicle = v.data.vehicle;
  const dealership = d.data.dealership;
  const ctx: VehicleContext = { vehicle, dealership, user };
  const unchecked = evidence.data?.zones.filter((z) => z.state === "unchecked").length;
  return (
    <>
      <p className="mb-2 text-sm"><Link to="/app/vehicles">← Stock</Link></p>
      <header className="mb-4 flex flex-wrap items-end justify-between gap-4">
        <div>
          <p className="font-mono text-sm text-ink-soft">Stock no. {vehicle.stockNumber}{vehicle.vin ? ` · ${vehicle.vin}` : ""}</p>
          <h1 className="text-2xl font-bold">{vehicleTitle(vehicle)} <span className="font-normal text-ink-soft">{vehicle.variant}</span></h1>
          <p className="mt-1 flex flex-wrap items-center gap-3 text-sm">
            <StatusBadge status={vehicle.status} />
            <span className="figures">{odometerText(vehicle, dealership.locale)}</span>
            <span className="figures font-bold">{priceText(vehicle.priceCents, dealership.currency, dealership.locale)}</span>
            <span className="text-ink-soft">{vehicle.daysInStock} day{vehicle.daysInStock === 1 ? "" : "s"} in stock</span>
          </p>
        </div>
      </header>
      <nav aria-label="Vehicle sections" className="mb-6 overflow-x-auto border-b border-line">
        <ul className="flex gap-1">
          {TABS.map((t) => (
            <li key={t.label}>
              <NavLink
                to={t.to}
                end={t.end}
                ref={(el) => {
                  // On a phone the tab bar scrolls sideways; keep the open section's tab in view without moving the page.
                  const bar = el?.closest("nav");
                  if (el && bar && el.getAttribute("aria-current") === "page") bar.scrollLeft = Math.max(0, el.offsetLeft - 16);
                }}
                className={({ isActive }) => `block whitespace-nowrap border-b-3 px-4 py-3 font-bold no-underline ${isActive ? "border-signal text-ink" : "border-transparent text-ink-soft hover:text-ink"}`}
              >
                {t.label}
                {t.to === "photos" && photos.data ? <span className="ml-1 text-xs font-normal">({photos.data.photos.length})</span> : null}
                {t.to === "walkaround" && unchecked ? <span className="ml-1 text-xs font-normal">({unchecked} to check)</span> : null}
              </NavLink>
            </li>
          ))}
        </ul>
      </nav>
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_19rem] 2xl:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0">
          <Outlet context={ctx} />
        </div>
        <aside className="flex flex-col gap-6">
          <Panel title="Condition">
            {evidence.isPending ? (
              <Loading label="Loading the condition…" />
            ) : evidence.isError ? (
              <Notice tone="danger" title={evidence.error.message} />
            ) : (
              <ConditionSummary evidence={evidence.data} />
            )}
          </Panel>
          <Panel title="Publishing">
            <PublishPanel vehicle={vehicle} role={user.role} />
          </Panel>
          {can(user, "vehicle.share") ? (
            <Panel title="Send to a buyer">
              <ShareVehicle vehicleId={vehicle.id} published={Boolean(vehicle.publishing.url) && (vehicle.status === "live" || vehicle.status === "reserved")} />
            </Panel>
          ) : null}
          <Panel title="Status">
            <StatusActions vehicle={vehicle} role={user.role} />
          </Panel>
        </aside>
      </div>
    </>
  );
}
