import { useState } from 'react';
import { useParams } from 'react-router';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PackageCheck } from 'lucide-react';
import { todayIso, type ReceiveOrder, type ReceivingView } from '@lotwise/shared';
import { SafetyCaution } from '../../../components/hazards/safety-caution';
import { Button } from '../../../components/ui/button';
import { useConfirmation } from '../../../components/ui/confirmation-dialog';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { errorMessage, isApiError, sendWithConfirmation } from '../../../lib/api-client';
import { formatAmount } from '../../../lib/format';
import { purchaseKeys, receiveOrder, uploadCertificate, useReceiving } from '../api';
import { BackLink } from '../components/back-link';
import { ChemicalCell, PlaceSelect } from '../components/line-parts';
import { OrderStatusBadge } from '../components/order-status-badge';
import { ReceivedView } from '../components/received-portions';

interface LineInput {
  packsReceived: string;
  supplierLotNumber: string;
  expiresOn: string;
  certificate: File | null;
}

const th = 'px-2.5 py-2';

function ReceiveForm({ view }: { view: ReceivingView }) {
  const queryClient = useQueryClient();
  const confirmation = useConfirmation();
  const [receivedOn, setReceivedOn] = useState(todayIso());
  const [locationId, setLocationId] = useState('');
  const [lines, setLines] = useState<Record<number, LineInput>>(() =>
    Object.fromEntries(
      view.lines.map((line) => [
        line.lineId,
        {
          packsReceived: String(line.packs),
          supplierLotNumber: '',
          expiresOn: '',
          certificate: null,
        },
      ]),
    ),
  );
  const [places, setPlaces] = useState<Record<number, string>>({});
  const [fields, setFields] = useState<Record<string, string>>({});
  const [certificateError, setCertificateError] = useState<string | null>(null);

  const receive = useMutation({
    mutationFn: async (body: ReceiveOrder) => {
      const result = await sendWithConfirmation(
        (confirm) => receiveOrder(view.orderId, { ...body, confirm }),
        confirmation.ask,
      );
      if (!result) return null;
      // The certificates go to the lots just made, through the lots' own upload.
      const failed: string[] = [];
      for (const line of result.lines) {
        const file = lines[line.lineId]?.certificate;
        if (!file || !line.lot) continue;
        try {
          await uploadCertificate(line.lot.id, file);
        } catch (error) {
          failed.push(`${line.chemical.name}: ${errorMessage(error)}`);
        }
      }
      if (failed.length > 0) {
        setCertificateError(
          `The delivery was received, but a certificate was not stored (${failed.join('; ')}). Add it on the container’s page.`,
        );
      }
      return result;
    },
    onSuccess: (result) => {
      if (!result) return;
      queryClient.setQueryData(purchaseKeys.receiving(view.orderId), result);
      void queryClient.invalidateQueries({ queryKey: purchaseKeys.all });
      void queryClient.invalidateQueries({ queryKey: ['stock'] });
      void queryClient.invalidateQueries({ queryKey: ['orders'] });
    },
    onError: (error) => {
      if (isApiError(error)) setFields(error.fields);
    },
  });

  function setLine(lineId: number, change: Partial<LineInput>) {
    setLines((current) => ({ ...current, [lineId]: { ...current[lineId]!, ...change } }));
  }

  function handleSubmit(event: React.FormEvent) {
    event.preventDefault();
    setFields({});
    setCertificateError(null);
    if (!locationId) {
      setFields({ locationId: 'Choose where the portions are stored.' });
      return;
    }
    receive.mutate({
      receivedOn,
      locationId: Number(locationId),
      lines: view.lines.map((line) => {
        const input = lines[line.lineId]!;
        return {
          lineId: line.lineId,
          packsReceived: Number(input.packsReceived),
          supplierLotNumber: input.supplierLotNumber,
          expiresOn: input.expiresOn || null,
        };
      }),
      shares: Object.entries(places)
        .filter(([, place]) => place !== '')
        .map(([shareId, place]) => ({ shareId: Number(shareId), locationId: Number(place) })),
    });
  }

  const count = view.lines.reduce((sum, line) => sum + line.shares.length, 0);
  return (
    <form noValidate onSubmit={handleSubmit} className="flex flex-col gap-5">
      <section
        aria-labelledby="receive-where-heading"
        className="grid gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3 sm:grid-cols-2"
      >
        <h2 id="receive-where-heading" className="text-base font-semibold sm:col-span-2">
          1. When and where
        </h2>
        <Field label="Received on" error={fields.receivedOn}>
          {(c) => (
            <Input
              {...c}
              type="date"
              value={receivedOn}
              onChange={(e) => setReceivedOn(e.target.value)}
            />
          )}
        </Field>
        <Field
          label="Store the portions in"
          hint="Every portion goes here unless you choose another place for it below"
          error={fields.locationId}
        >
          {(c) => (
            <PlaceSelect
              {...c}
              value={locationId}
              onChange={setLocationId}
              emptyLabel="Choose a location"
            />
          )}
        </Field>
      </section>

      {view.lines.map((line, lineIndex) => {
        const input = lines[line.lineId]!;
        const prefix = `lines.${lineIndex}`;
        return (
          <section
            key={line.lineId}
            aria-label={`What came for ${line.chemical.name}`}
            className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3"
          >
            <h2 className="text-base font-semibold">
              {lineIndex + 2}. {line.chemical.name}
            </h2>
            <ChemicalCell line={line} named={false} />
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
              <Field
                label="Packs received"
                hint={`${line.packs} ordered`}
                error={fields[`${prefix}.packsReceived`]}
              >
                {(c) => (
                  <Input
                    {...c}
                    inputMode="numeric"
                    value={input.packsReceived}
                    onChange={(e) => setLine(line.lineId, { packsReceived: e.target.value })}
                  />
                )}
              </Field>
              <Field
                label="Supplier lot number"
                optional
                hint="As on the bottle or the certificate"
                error={fields[`${prefix}.supplierLotNumber`]}
              >
                {(c) => (
                  <Input
                    {...c}
                    value={input.supplierLotNumber}
                    onChange={(e) => setLine(line.lineId, { supplierLotNumber: e.target.value })}
                  />
                )}
              </Field>
              <Field label="Expires on" optional error={fields[`${prefix}.expiresOn`]}>
                {(c) => (
                  <Input
                    {...c}
                    type="date"
                    value={input.expiresOn}
                    onChange={(e) => setLine(line.lineId, { expiresOn: e.target.value })}
                  />
                )}
              </Field>
              <Field label="Certificate of analysis" optional hint="PDF, or a scan as PNG or JPEG">
                {(c) => (
                  <input
                    {...c}
                    type="file"
                    accept="application/pdf,.pdf,image/png,.png,image/jpeg,.jpg,.jpeg"
                    className="text-sm"
                    onChange={(e) =>
                      setLine(line.lineId, { certificate: e.target.files?.[0] ?? null })
                    }
                  />
                )}
              </Field>
            </div>
            <table className="w-full text-sm" aria-label={`Portions of ${line.chemical.name}`}>
              <thead className="border-b border-ink-200 text-left text-xs font-semibold tracking-wide text-ink-600 uppercase">
                <tr>
                  <th className={th}>Portion for</th>
                  <th className={`${th} text-right`}>Claimed</th>
                  <th className={`${th} text-right`}>Into stock</th>
                  <th className={th}>Location</th>
                </tr>
              </thead>
              <tbody>
                {line.shares.map((share) => (
                  <tr key={share.shareId} className="border-b border-ink-100 last:border-b-0">
                    <td className={th}>{share.holder}</td>
                    <td className={`${th} text-right tabular-nums`}>
                      {formatAmount(share.quantity, share.packUnit)}
                    </td>
                    <td className={`${th} text-right tabular-nums`}>
                      {share.stockQuantity === null
                        ? 'needs the density'
                        : formatAmount(share.stockQuantity, share.stockUnit)}
                    </td>
                    <td className={th}>
                      <PlaceSelect
                        aria-label={`Location of ${share.holder}’s portion`}
                        value={places[share.shareId] ?? ''}
                        onChange={(value) =>
                          setPlaces((current) => ({ ...current, [share.shareId]: value }))
                        }
                        emptyLabel="Same as above"
                      />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
        );
      })}

      {receive.isError && (
        <Notice tone="danger" title="Nothing was received">
          {errorMessage(receive.error)}
        </Notice>
      )}
      {certificateError && <Notice tone="warn">{certificateError}</Notice>}
      <div className="flex items-center gap-3">
        <Button
          type="submit"
          variant="primary"
          busy={receive.isPending}
          icon={<PackageCheck aria-hidden="true" className="size-4" />}
        >
          Receive into {count} {count === 1 ? 'container' : 'containers'}
        </Button>
        {receive.isPending && (
          <span className="text-sm text-ink-600">Making the lots and the members’ containers…</span>
        )}
      </div>
      {confirmation.dialog}
    </form>
  );
}

/** `/orders/:id/receive`: an ordered delivery into stock, one container per member's portion. */
export function ReceiveOrderPage() {
  const orderId = Number(useParams().id);
  const query = useReceiving(orderId);
  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.orders}>Orders</BackLink>
      {query.isPending ? (
        <PageSpinner label="Loading the order…" />
      ) : query.isError ? (
        <ErrorState error={query.error} onRetry={() => void query.refetch()} />
      ) : (
        <>
          <header>
            <h1 className="text-xl font-semibold text-ink-900">
              Receive order #{query.data.orderId}: {query.data.title}
            </h1>
            <p className="flex flex-wrap items-center gap-2 text-sm text-ink-600">
              <OrderStatusBadge status={query.data.status} />
              {query.data.supplierName}
              {query.data.supplierReference && ` · reference ${query.data.supplierReference}`}
            </p>
            {query.data.receivable && (
              <p className="mt-1 max-w-3xl text-sm text-ink-600">
                Record what came for each line. Lotwise makes a lot per line and pours each pack
                into one labelled container per share, owned by its member (the lab’s share stays
                the lab’s). Everything is saved together, or nothing is.
              </p>
            )}
          </header>
          {query.data.receivable ? (
            <ReceiveForm view={query.data} />
          ) : query.data.status === 'received' || query.data.status === 'closed' ? (
            <ReceivedView view={query.data} />
          ) : (
            <Notice tone="info" title="Not ready to receive">
              Only an order marked ordered can be received; this one is {query.data.status}.
            </Notice>
          )}
          <SafetyCaution compact />
        </>
      )}
    </div>
  );
}

export { ReceiveOrderPage as Component };
