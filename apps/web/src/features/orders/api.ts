import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import {
  type CashPaymentBody,
  orderDetailSchema,
  orderSummarySchema,
  packUnits,
  pageSchema,
  type OrderCreate,
  type OrderDetail,
  type OrderMarkOrdered,
  type OrderPatch,
  type OrderStatus,
} from '@lotwise/shared';
import { api, apiRequest, withQuery } from '../../lib/api-client';

export interface OrderListParams {
  q: string;
  sort: string;
  page: number;
  pageSize: number;
  status?: OrderStatus;
}

/** Every query of shared orders sits under `['orders']`. */
export const orderKeys = {
  all: ['orders'] as const,
  list: (params: OrderListParams) => [...orderKeys.all, 'list', params] as const,
  detail: (id: number) => [...orderKeys.all, 'detail', id] as const,
  suppliers: () => [...orderKeys.all, 'suppliers'] as const,
  catalogue: (supplierId: number) => [...orderKeys.all, 'catalogue', supplierId] as const,
};

const orderPageSchema = pageSchema(orderSummarySchema);

export function useOrders(params: OrderListParams) {
  return useQuery({
    queryKey: orderKeys.list(params),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/orders', { ...params }), orderPageSchema, signal),
    placeholderData: keepPreviousData,
  });
}

/** How often an order is asked again after a checkout, until the provider's confirmation lands. */
export const paymentPollMs = 2000;

/**
 * One order. With `awaitingPaidShareId` (back from a checkout), it is asked again every
 * {@link paymentPollMs} until that share reads paid (or is not on the order).
 */
export function useOrder(id: number, awaitingPaidShareId: number | null = null) {
  return useQuery({
    queryKey: orderKeys.detail(id),
    queryFn: ({ signal }) => api.get(`/api/orders/${id}`, orderDetailSchema, signal),
    refetchInterval: (query) => {
      if (awaitingPaidShareId === null || !query.state.data) return false;
      const share = query.state.data.shares.find((item) => item.id === awaitingPaidShareId);
      return share && share.paymentStatus !== 'paid' ? paymentPollMs : false;
    },
  });
}

/** What the order pages read of the suppliers' list (`GET /api/suppliers`). */
const supplierOptionSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  archived: z.boolean().optional(),
});
const supplierOptionsSchema = z.object({ items: z.array(supplierOptionSchema) });

/** What the order form reads of a supplier's catalogue (`GET /api/catalog-items?supplierId=`). */
const catalogueItemSchema = z.object({
  id: z.number().int(),
  sku: z.string(),
  chemicalId: z.number().int(),
  chemicalName: z.string(),
  packSize: z.number(),
  packUnit: z.enum(packUnits),
  priceMinor: z.number().int(),
  currency: z.string(),
  hazardous: z.boolean(),
  splittable: z.boolean(),
  discontinued: z.boolean().optional(),
});
export type CatalogueItem = z.infer<typeof catalogueItemSchema>;
const catalogueSchema = z.object({ items: z.array(catalogueItemSchema) });

export function useSupplierOptions() {
  return useQuery({
    queryKey: orderKeys.suppliers(),
    queryFn: ({ signal }) =>
      api.get(withQuery('/api/suppliers', { pageSize: 200 }), supplierOptionsSchema, signal),
  });
}

export function useCatalogue(supplierId: number | null) {
  return useQuery({
    queryKey: orderKeys.catalogue(supplierId ?? 0),
    queryFn: ({ signal }) =>
      api.get(
        withQuery('/api/catalog-items', { supplierId: supplierId ?? undefined, pageSize: 200 }),
        catalogueSchema,
        signal,
      ),
    enabled: supplierId !== null,
  });
}

/** A write on one order that answers the order as it now stands; the cache takes the answer. */
function useOrderWrite<V>(orderId: number, send: (variables: V) => Promise<OrderDetail>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: async (order) => {
      queryClient.setQueryData(orderKeys.detail(orderId), order);
      await queryClient.invalidateQueries({ queryKey: [...orderKeys.all, 'list'] });
    },
  });
}

const post = (path: string, body: unknown = {}) =>
  apiRequest(path, { method: 'POST', body, schema: orderDetailSchema });

export function useCreateOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: OrderCreate) => post('/api/orders', body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: [...orderKeys.all, 'list'] }),
  });
}

export function useClaim(orderId: number) {
  return useOrderWrite(orderId, (body: { lineId: number; quantity: number }) =>
    post(`/api/orders/${orderId}/shares`, body),
  );
}

export function useChangeShare(orderId: number) {
  return useOrderWrite(orderId, ({ shareId, quantity }: { shareId: number; quantity: number }) =>
    apiRequest(`/api/orders/${orderId}/shares/${shareId}`, {
      method: 'PATCH',
      body: { quantity },
      schema: orderDetailSchema,
    }),
  );
}

export function useWithdrawShare(orderId: number) {
  return useOrderWrite(orderId, (shareId: number) =>
    apiRequest(`/api/orders/${orderId}/shares/${shareId}`, {
      method: 'DELETE',
      schema: orderDetailSchema,
    }),
  );
}

/** The coordinator's moves that take no input. */
export type OrderStep = 'open' | 'lab-remainder' | 'close-claims';

export function useOrderStep(orderId: number) {
  return useOrderWrite(orderId, (step: OrderStep) => post(`/api/orders/${orderId}/${step}`));
}

export function useMarkOrdered(orderId: number) {
  return useOrderWrite(orderId, (body: OrderMarkOrdered) =>
    post(`/api/orders/${orderId}/mark-ordered`, body),
  );
}

export function useRecordInvoice(orderId: number) {
  return useOrderWrite(orderId, (supplierInvoiceMinor: number) =>
    apiRequest(`/api/orders/${orderId}/supplier-invoice`, {
      method: 'PUT',
      body: { supplierInvoiceMinor },
      schema: orderDetailSchema,
    }),
  );
}

export function useUpdateOrder(orderId: number) {
  return useOrderWrite(orderId, (patch: OrderPatch) =>
    apiRequest(`/api/orders/${orderId}`, {
      method: 'PATCH',
      body: patch,
      schema: orderDetailSchema,
    }),
  );
}

export function useChangeLinePacks(orderId: number) {
  return useOrderWrite(orderId, ({ lineId, packs }: { lineId: number; packs: number }) =>
    apiRequest(`/api/orders/${orderId}/lines/${lineId}`, {
      method: 'PATCH',
      body: { packs },
      schema: orderDetailSchema,
    }),
  );
}

export function useRemoveLine(orderId: number) {
  return useOrderWrite(orderId, (lineId: number) =>
    apiRequest(`/api/orders/${orderId}/lines/${lineId}`, {
      method: 'DELETE',
      schema: orderDetailSchema,
    }),
  );
}

export function useCancelOrder(orderId: number) {
  return useOrderWrite(orderId, (reason: string) =>
    post(`/api/orders/${orderId}/cancel`, { reason }),
  );
}

const checkoutSchema = z.object({ url: z.string().min(1) });

/** Starts paying a share online: the server makes the checkout and answers where to go. */
export function useCheckout(orderId: number) {
  return useMutation({
    mutationFn: (shareId: number) =>
      api.post(`/api/orders/${orderId}/shares/${shareId}/checkout`, {}, checkoutSchema),
    onSuccess: ({ url }) => window.location.assign(url),
  });
}

/** Records money the coordinator received in cash, or the lab's own funds for its share. */
export function useRecordPayment(orderId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ shareId, ...body }: CashPaymentBody & { shareId: number }) =>
      api.post(`/api/orders/${orderId}/shares/${shareId}/cash-payment`, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: orderKeys.all }),
  });
}

/** A manager approves the watched and restricted chemicals on the lines, with a reason. */
export function useApproveWatch(orderId: number) {
  return useOrderWrite(orderId, (reason: string) =>
    post(`/api/orders/${orderId}/watch-approval`, { reason }),
  );
}
