import { lazy, Suspense } from 'react';
import { Dialog } from '../../../components/ui/dialog';
import { PageSpinner } from '../../../components/ui/spinner';

const LabelScanner = lazy(async () => ({
  default: (await import('./label-scanner')).LabelScanner,
}));

/** The camera view of "Scan a label", in its dialog; Escape or Close shuts both. */
export function ScanLabelDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  return (
    <Dialog
      open={open}
      onClose={onClose}
      title="Scan a label"
      description="Point the camera at a container’s QR label: its page opens, ready to record a draw."
    >
      <Suspense fallback={<PageSpinner label="Opening the camera view…" />}>
        <LabelScanner onDone={onClose} />
      </Suspense>
    </Dialog>
  );
}
