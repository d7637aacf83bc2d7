import { lazy, Suspense, useCallback, useState } from 'react';
import { ScanLine } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { PageSpinner } from '../../../components/ui/spinner';
import { useCameraLikely } from '../use-camera';

const LabelScanner = lazy(async () => ({
  default: (await import('./label-scanner')).LabelScanner,
}));

/**
 * "Scan a label" in the top bar: on a phone or tablet, or wherever a camera is listed. Opens the
 * camera view; Escape or Close shuts it and the camera with it.
 */
export function ScanLabelButton() {
  const likely = useCameraLikely();
  const [open, setOpen] = useState(false);
  const close = useCallback(() => setOpen(false), []);
  if (!likely) return null;
  return (
    <>
      <Button
        variant="secondary"
        className="min-h-11 shrink-0 md:min-h-9"
        icon={<ScanLine aria-hidden="true" className="size-4" />}
        onClick={() => setOpen(true)}
        title="Scan a container’s QR label with the camera"
      >
        <span className="sr-only sm:not-sr-only">Scan a label</span>
      </Button>
      <Dialog
        open={open}
        onClose={close}
        title="Scan a label"
        description="Point the camera at a container’s QR label: its page opens, ready to record a draw."
      >
        <Suspense fallback={<PageSpinner label="Opening the camera view…" />}>
          <LabelScanner onDone={close} />
        </Suspense>
      </Dialog>
    </>
  );
}
