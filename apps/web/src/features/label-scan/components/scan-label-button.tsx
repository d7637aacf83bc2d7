import { lazy, Suspense, useCallback, useState } from 'react';
import { ScanLine } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { useCameraLikely } from '../use-camera';

// The dialog and the camera view load when the button is first pressed: the top bar of every
// page carries only the button.
const ScanLabelDialog = lazy(async () => ({
  default: (await import('./scan-label-dialog')).ScanLabelDialog,
}));

/**
 * "Scan a label" in the top bar: on a phone or tablet, or wherever a camera is listed. Opens the
 * camera view; Escape or Close shuts it and the camera with it.
 */
export function ScanLabelButton() {
  const likely = useCameraLikely();
  const [open, setOpen] = useState(false);
  // Once opened, the dialog stays mounted (closed), so that closing returns the focus here.
  const [wanted, setWanted] = useState(false);
  const close = useCallback(() => setOpen(false), []);
  if (!likely) return null;
  return (
    <>
      <Button
        variant="secondary"
        className="min-h-11 shrink-0 md:min-h-9"
        icon={<ScanLine aria-hidden="true" className="size-4" />}
        onClick={() => {
          setWanted(true);
          setOpen(true);
        }}
        title="Scan a container’s QR label with the camera"
      >
        <span className="sr-only sm:not-sr-only">Scan a label</span>
      </Button>
      {wanted && (
        <Suspense fallback={null}>
          <ScanLabelDialog open={open} onClose={close} />
        </Suspense>
      )}
    </>
  );
}
