import { useVehicleContext } from "../layouts/VehicleLayout.tsx";
import { VehicleEditor } from "../../features/vehicles/editor/VehicleEditor.tsx";
import { HistoryPanel } from "../../features/vehicles/components/HistoryPanel.tsx";
import { Panel } from "../../components/ui/Page.tsx";

/** The record itself: identity, specification, economy, history, copy and price, then the audit trail. */
export default function VehicleRecordRoute() {
  const { vehicle, dealership, user } = useVehicleContext();
  return (
    <div className="flex flex-col gap-6">
      <VehicleEditor key={vehicle.id} vehicle={vehicle} dealership={dealership} role={user.role} />
      <Panel title="History">
        <HistoryPanel id={vehicle.id} />
      </Panel>
    </div>
  );
}
