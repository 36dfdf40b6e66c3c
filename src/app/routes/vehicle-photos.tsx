import { useVehicleContext } from "../layouts/VehicleLayout.tsx";
import { usePhotos, useRefreshPhotos } from "../../features/photos/api/photos.ts";
import { UploadQueue } from "../../features/photos/components/UploadQueue.tsx";
import { PhotoGrid } from "../../features/photos/components/PhotoGrid.tsx";
import { EmptyState, Loading, Notice } from "../../components/feedback/Notice.tsx";
import { Panel } from "../../components/ui/Page.tsx";
import { can } from "../../../shared/permissions.ts";

export default function VehiclePhotosRoute() {
  const { vehicle, dealership, user } = useVehicleContext();
  const photos = usePhotos(vehicle.id);
  const refresh = useRefreshPhotos(vehicle.id);
  const editable = can(user, "evidence.write");
  const needed = photos.data ? `${photos.data.photos.length} of at least ${dealership.minPhotos}` : `At least ${dealership.minPhotos}`;
  return (
    <div className="flex flex-col gap-6">
      {editable ? (
        <Panel title="Add photos">
          <p className="mb-3 text-sm text-ink-soft">
            {needed} photos before this vehicle may go live. Photograph each side, front and rear, the interior,
            the odometer, and a close-up of every defect with a ruler beside it.
          </p>
          <UploadQueue vehicleId={vehicle.id} onUploaded={() => void refresh()} disabled={false} />
        </Panel>
      ) : (
        <Notice tone="info" title="Marketing can view the photos; workshop and sales add and arrange them." />
      )}
      {photos.isPending ? (
        <Loading label="Loading photos…" />
      ) : photos.isError ? (
        <Notice tone="danger" title={photos.error.message} />
      ) : photos.data.photos.length === 0 ? (
        <EmptyState title="No photos yet">Take the first one with “Take a photo”.</EmptyState>
      ) : (
        <PhotoGrid vehicleId={vehicle.id} photos={photos.data.photos} editable={editable} />
      )}
    </div>
  );
}
