import { useVehicleContext } from "../layouts/VehicleLayout.tsx";
import { useVehicleEvidence } from "../../features/vehicles/api/evidence.ts";
import { ChecksScreen } from "../../features/checks/components/ChecksScreen.tsx";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";

/** Tyres and checks: the workshop's tread, size, age and safety checks, with the cautions they call for. */
export default function VehicleChecksRoute() {
  const { vehicle, dealership, user } = useVehicleContext();
  const evidence = useVehicleEvidence(vehicle.id);
  if (evidence.isError) return <Notice tone="danger" title={evidence.error.message} />;
  if (evidence.isPending) return <Loading label="Loading the tyres and checks…" />;
  return <ChecksScreen key={vehicle.id} vehicle={{ id: vehicle.id, evidence: evidence.data }} dealership={dealership} role={user.role} />;
}
