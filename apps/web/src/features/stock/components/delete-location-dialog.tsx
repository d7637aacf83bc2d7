import type { Location } from '@lotwise/shared';
import { ConfirmDialog } from '../../../components/ui/dialog';
import { Notice } from '../../../components/ui/notice';
import { errorMessage } from '../../../lib/api-client';
import { useDeleteLocation } from '../api';

/** Removes an empty place; the server refuses (409) while it still holds places or containers. */
export function DeleteLocationDialog({
  location,
  onClose,
  onDeleted,
}: {
  location: Location;
  onClose: () => void;
  onDeleted?: () => void;
}) {
  const remove = useDeleteLocation();
  return (
    <ConfirmDialog
      open
      title={`Delete ${location.name}?`}
      confirmLabel="Delete place"
      busy={remove.isPending}
      onConfirm={() =>
        remove.mutate(location.id, {
          onSuccess: () => {
            onDeleted?.();
            onClose();
          },
        })
      }
      onCancel={onClose}
      error={
        remove.isError && (
          <Notice tone="danger" title="Not deleted">
            {errorMessage(remove.error)}
          </Notice>
        )
      }
    >
      <p>
        {location.path} is removed from the list of places. Only an empty place can be deleted: move
        its containers and the places inside it first.
      </p>
    </ConfirmDialog>
  );
}
