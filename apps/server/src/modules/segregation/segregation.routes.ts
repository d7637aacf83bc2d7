import type { Store } from '../../db/store';
import { defineRoute } from '../../lib/route-table';
import { segregationService } from './segregation.service';

export function segregationRoutes(store: Store) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/segregation/conflicts',
      access: 'stock.read',
      handle: async ({ res }) => {
        res.json(await segregationService(store.repos).conflicts());
      },
    }),
  ];
}
