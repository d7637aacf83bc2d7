import { useParams } from 'react-router';
import { Printer } from 'lucide-react';
import { Button } from '../../../components/ui/button';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useReceipt } from '../api';
import { BackLink } from '../components/back-link';
import { ReceiptView } from '../components/receipt-view';

/** `/orders/:id/receipt`: the signed-in member's receipt, printable or saved as PDF. */
export function ReceiptPage() {
  const orderId = Number(useParams().id);
  const receipt = useReceipt(orderId);
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3 print:hidden">
        <BackLink to={paths.purchases}>My purchases</BackLink>
        <Button
          variant="primary"
          onClick={() => window.print()}
          disabled={!receipt.data}
          icon={<Printer aria-hidden="true" className="size-4" />}
        >
          Print or save as PDF
        </Button>
      </div>
      {receipt.isPending ? (
        <PageSpinner label="Loading the receipt…" />
      ) : receipt.isError ? (
        <ErrorState
          title="The receipt could not be loaded"
          error={receipt.error}
          onRetry={() => void receipt.refetch()}
        />
      ) : (
        <ReceiptView receipt={receipt.data} />
      )}
    </div>
  );
}

export { ReceiptPage as Component };
