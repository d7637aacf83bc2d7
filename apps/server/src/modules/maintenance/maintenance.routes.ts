import type { Store } from '../../db/store';
import { defineRoute } from '../../lib/route-table';
import { checkLedger } from './ledger-check';

export function maintenanceRoutes(store: Store) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/maintenance/ledger-check',
      access: 'maintenance.run',
      handle: async ({ res }) => {
        res.json(await checkLedger(store.repos));
      },
    }),
  ];
}
