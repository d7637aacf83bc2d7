import type { ComponentType } from 'react';
import type { RouteObject } from 'react-router';
import type { Permission } from '@lotwise/shared';
import { paths } from '../config/paths';
import { lazyPage } from './lazy-page';

/** A page of shared orders, loaded when first opened. */
function orderPage(
  path: string,
  load: () => Promise<ComponentType>,
  permission: Permission = 'orders.read',
): RouteObject {
  return lazyPage(path, load, permission);
}

/** Shared orders: the list, a new draft (coordinators) and one order with its claims. */
export const orderRoutes: RouteObject[] = [
  orderPage(
    paths.orders,
    async () => (await import('../features/orders/pages/orders-list-page')).OrdersListPage,
  ),
  orderPage(
    paths.orderNew,
    async () => (await import('../features/orders/pages/order-new-page')).OrderNewPage,
    'orders.manage',
  ),
  orderPage(
    paths.order(),
    async () => (await import('../features/orders/pages/order-page')).OrderPage,
  ),
];
