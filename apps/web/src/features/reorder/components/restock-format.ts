import { paths } from '../../../config/paths';

/** Where an order's page is (the orders screens own it). */
export const orderHref = (orderId: number) => `${paths.orders}/${orderId}`;

/** Whole days, rounded down: "about 41 days" is what is left, never more. */
export function wholeDays(days: number): number {
  return Math.floor(days + 1e-9);
}

/** "1 day", "21 days". */
export function daysText(days: number): string {
  return `${days} ${days === 1 ? 'day' : 'days'}`;
}
