import { defineRoute } from '../../lib/route-table';
import type { TodayService } from './today.service';

export function todayRoutes(today: TodayService) {
  return [
    /** The signed-in person's start page: only the sections their role may see. */
    defineRoute({
      method: 'get',
      path: '/api/today',
      access: 'signed-in',
      handle: async ({ res, actor }) => {
        res.json(await today.forUser(actor()));
      },
    }),
  ];
}
