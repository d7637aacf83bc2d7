import { Link } from 'react-router';
import { Coins, PackageCheck, ReceiptText } from 'lucide-react';
import { can, type OrderStatus, type Role } from '@lotwise/shared';
import { buttonClasses } from '../ui/button';
import { paths } from '../../config/paths';

/**
 * Links from an order's page to what this feature shows about it: the member's receipt (when
 * they have a share), the coordinator's money summary, and receiving once it is ordered.
 */
export function OrderMoneyLinks({
  orderId,
  status,
  role,
  hasShare,
}: {
  orderId: number;
  status: OrderStatus;
  role: Role;
  hasShare: boolean;
}) {
  const manage = can(role, 'orders.manage');
  return (
    <div className="flex flex-wrap gap-2 print:hidden">
      {hasShare && status !== 'draft' && (
        <Link to={paths.orderReceipt(orderId)} className={buttonClasses('secondary', 'sm')}>
          <ReceiptText aria-hidden="true" className="size-4" />
          My receipt
        </Link>
      )}
      {manage && status !== 'draft' && (
        <Link to={paths.orderMoney(orderId)} className={buttonClasses('secondary', 'sm')}>
          <Coins aria-hidden="true" className="size-4" />
          Money
        </Link>
      )}
      {manage && can(role, 'stock.write') && (status === 'ordered' || status === 'received') && (
        <Link
          to={paths.orderReceive(orderId)}
          className={buttonClasses(status === 'ordered' ? 'primary' : 'secondary', 'sm')}
        >
          <PackageCheck aria-hidden="true" className="size-4" />
          {status === 'ordered' ? 'Receive the delivery' : 'Received stock'}
        </Link>
      )}
    </div>
  );
}
