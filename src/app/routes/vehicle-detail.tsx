import { Link, useParams } from "react-router";
import { useStaffUser } from "../RequireRole.tsx";
import { useDealership } from "../../features/settings/api/dealership.ts";
import { useVehicle } from "../../features/vehicles/api/vehicles.ts";
import { VehicleEditor } from "../../features/vehicles/editor/VehicleEditor.tsx";
import { StatusActions } from "../../features/vehicles/components/StatusActions.tsx";
import { StatusBadge } from "../../features/vehicles/components/StatusBadge.tsx";
import { HistoryPanel } from "../../features/vehicles/components/HistoryPanel.tsx";
import { odometerText, priceText, vehicleTitle } from "../../features/vehicles/format.ts";
import { Panel } from "../../components/ui/Page.tsx";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";

export default function VehicleDetailRoute() {
  const { id } = useParams();
  const vehicleId = Number(id);
  const user = useStaffUser();
  const v = useVehicle(vehicleId);
  const d = useDealership();
  if (!Number.isInteger(vehicleId)) return <Notice tone="danger" title="That is not a vehicle address." />;
  if (v.isPending || d.isPending) return <Loading label="Loading the vehicle…" />;
  if (v.isError) return <Notice tone="danger" title={v.error.status === 404 ? "That vehicle does not exist, or belongs to another dealership." : v.error.message} />;
  if (d.isError) return <Notice tone="danger" title={d.error.message} />;
  const vehicle = v.data.vehicle;
  const dealership = d.data.dealership;
  return (
    <>
      <p className="mb-2 text-sm"><Link to="/app/vehicles">← Stock</Link></p>
      <header className="mb-6 flex flex-wrap items-end justify-between gap-4 border-b border-line pb-4">
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
      <div className="flex flex-col gap-6">
        <Panel title="Status">
          <StatusActions vehicle={vehicle} role={user.role} />
        </Panel>
        {/* key: a newer version from elsewhere (a status move) restarts the editor on the new base */}
        <VehicleEditor key={vehicle.id} vehicle={vehicle} dealership={dealership} role={user.role} />
        <Panel title="History">
          <HistoryPanel id={vehicle.id} />
        </Panel>
      </div>
    </>
  );
}
