import type { Container } from '@lotwise/shared';
import { FileBadge } from 'lucide-react';
import { ErrorState } from '../../../components/ui/error-state';
import { Skeleton } from '../../../components/ui/spinner';
import { useCan } from '../../../lib/auth';
import { storedFileUrls, useLot } from '../api';
import { lotSummary } from './containers-table';
import { StoredFilePanel } from './stored-file-panel';

/** The lot a container came from, with its certificate of analysis. */
export function LotCertificateSection({ lot }: { lot: Container['lot'] }) {
  const details = useLot(lot.id);
  const mayWrite = useCan('stock.write');
  return (
    <section
      aria-labelledby="lot-certificate-heading"
      className="rounded-lg border border-ink-200 bg-white px-4 py-3"
    >
      <h2
        id="lot-certificate-heading"
        className="mb-1 flex items-center gap-2 text-base font-semibold"
      >
        <FileBadge aria-hidden="true" className="size-4 text-ink-600" />
        Certificate of analysis
      </h2>
      <p className="mb-3 text-sm text-ink-600">
        For the whole lot ({lotSummary(lot)}): every container of it shares this certificate.
      </p>
      {details.isPending ? (
        <Skeleton className="h-10 w-full" />
      ) : details.isError ? (
        <ErrorState
          title="The lot could not be loaded"
          error={details.error}
          onRetry={() => void details.refetch()}
        />
      ) : (
        <StoredFilePanel
          what="certificate"
          file={details.data.certificate}
          url={storedFileUrls.certificate(lot.id)}
          kind="pdf-or-image"
          canChange={mayWrite}
          missingText={
            lot.source === 'prepared'
              ? 'Made in-house: no supplier certificate. Upload your own analysis if you have one.'
              : 'No certificate uploaded for this lot yet.'
          }
        />
      )}
    </section>
  );
}
