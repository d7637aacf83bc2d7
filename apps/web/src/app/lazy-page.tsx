import type { ComponentType } from 'react';
import type { RouteObject } from 'react-router';
import type { Permission } from '@lotwise/shared';
import { RequirePermission } from './routes/guards';

/** Where a page sits: its own address, or the index page of its section. */
export type PagePlace = { path: string } | { index: true };

/**
 * A page whose code loads when it is first opened (React Router's lazy route), shown only
 * to roles holding `permission` when one is given. The router fetches the code of every
 * page a URL matches at once; while it does, the page on screen stays and the layout shows
 * that the next one is opening.
 */
export function lazyPage(
  place: PagePlace | string,
  load: () => Promise<ComponentType>,
  permission?: Permission,
): RouteObject {
  return {
    ...(typeof place === 'string' ? { path: place } : place),
    lazy: async () => {
      const Page = await load();
      return {
        element: permission ? (
          <RequirePermission permission={permission}>
            <Page />
          </RequirePermission>
        ) : (
          <Page />
        ),
      };
    },
  };
}
