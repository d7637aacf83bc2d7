import type { PublicSettings } from '@lotwise/shared';
import type { Config } from '../../config';
import { defineRoute } from '../../lib/route-table';

/** `GET /api/settings/public`: the set-up the web app needs, readable before signing in. */
export function settingsRoutes(config: Pick<Config, 'publicUrl'>) {
  const settings: PublicSettings = { publicUrl: config.publicUrl };
  return [
    defineRoute({
      method: 'get',
      path: '/api/settings/public',
      access: 'public',
      handle: ({ res }) => {
        res.json(settings);
      },
    }),
  ];
}
