import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  locationSchema,
  lotSchema,
  orderMoneySchema,
  pageSchema,
  purchaseListSchema,
  receiptSchema,
  receivingViewSchema,
  type ReceiveOrder,
} from '@lotwise/shared';
import { api } from '../../lib/api-client';
import { uploadFile } from '../../lib/upload';

export const purchaseKeys = {
  all: ['purchases'] as const,
  mine: () => [...purchaseKeys.all, 'mine'] as const,
  receipt: (orderId: number) => [...purchaseKeys.all, 'receipt', orderId] as const,
  money: (orderId: number) => [...purchaseKeys.all, 'money', orderId] as const,
  receiving: (orderId: number) => [...purchaseKeys.all, 'receiving', orderId] as const,
  places: () => [...purchaseKeys.all, 'places'] as const,
};

/** Where the CSV files for the books are downloaded from. */
export const moneyCsvUrl = (orderId?: number) =>
  orderId === undefined ? '/api/orders/money.csv' : `/api/orders/${orderId}/money.csv`;

export const myPurchasesQueryOptions = () =>
  queryOptions({
    queryKey: purchaseKeys.mine(),
    queryFn: ({ signal }) => api.get('/api/purchases', purchaseListSchema, signal),
  });

export function useMyPurchases() {
  return useQuery(myPurchasesQueryOptions());
}

export function useReceipt(orderId: number) {
  return useQuery({
    queryKey: purchaseKeys.receipt(orderId),
    queryFn: ({ signal }) => api.get(`/api/orders/${orderId}/receipt`, receiptSchema, signal),
  });
}

export function useOrderMoney(orderId: number) {
  return useQuery({
    queryKey: purchaseKeys.money(orderId),
    queryFn: ({ signal }) => api.get(`/api/orders/${orderId}/money`, orderMoneySchema, signal),
  });
}

export function useReceiving(orderId: number) {
  return useQuery({
    queryKey: purchaseKeys.receiving(orderId),
    queryFn: ({ signal }) =>
      api.get(`/api/orders/${orderId}/receiving`, receivingViewSchema, signal),
  });
}

/** Every storage place by path (a lab has few; the server's default page holds them all). */
export function usePlaces() {
  return useQuery({
    queryKey: purchaseKeys.places(),
    queryFn: ({ signal }) => api.get('/api/locations', pageSchema(locationSchema), signal),
  });
}

export function receiveOrder(orderId: number, body: ReceiveOrder) {
  return api.post(`/api/orders/${orderId}/receive`, body, receivingViewSchema);
}

/** The certificate of analysis of a lot made on receiving (the lots' own upload). */
export function uploadCertificate(lotId: number, file: File) {
  return uploadFile(`/api/lots/${lotId}/certificate`, file, { schema: lotSchema });
}

export function useCloseOrder(orderId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post(`/api/orders/${orderId}/close`, {}, receivingViewSchema),
    onSuccess: (view) => {
      queryClient.setQueryData(purchaseKeys.receiving(orderId), view);
      void queryClient.invalidateQueries({ queryKey: purchaseKeys.all });
      // The order page (another feature) reads the order's status too.
      void queryClient.invalidateQueries({ queryKey: ['orders'] });
    },
  });
}
