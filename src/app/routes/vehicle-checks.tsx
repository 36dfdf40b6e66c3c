import { useVehicleContext } from "../layouts/VehicleLayout.tsx";
import { ChecksScreen } from "../../features/checks/components/ChecksScreen.tsx";

/** Tyres and checks: the workshop's tread, size, age and safety checks, with the cautions they call for. */
export default function VehicleChecksRoute() {
  const { vehicle, dealership, user } = useVehicleContext();
  return <ChecksScreen key={vehicle.id} vehicle={vehicle} dealership={dealership} role={user.role} />;
}
