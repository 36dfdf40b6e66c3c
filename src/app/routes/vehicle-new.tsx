import { Link } from "react-router";
import { useStaffUser } from "../RequireAction.tsx";
import { useDealership } from "../../features/settings/api/dealership.ts";
import { VehicleEditor } from "../../features/vehicles/editor/VehicleEditor.tsx";
import { PageHeader } from "../../components/ui/Page.tsx";
import { Loading, Notice } from "../../components/feedback/Notice.tsx";

/** The page of a new vehicle; the router guards it with "vehicle.create". */
export default function NewVehicle() {
  const user = useStaffUser();
  const d = useDealership();
  return (
    <>
      <p className="mb-2 text-sm"><Link to="/app/vehicles">← Stock</Link></p>
      <PageHeader title="Add a vehicle" lead="Start with the make and model; fill in the rest now or as the vehicle moves through the yard. Your typing is kept in this browser until it is saved." />
      {d.isPending ? <Loading /> : d.isError ? <Notice tone="danger" title={d.error.message} /> : <VehicleEditor dealership={d.data.dealership} role={user.role} />}
    </>
  );
}
