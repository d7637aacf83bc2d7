import type { ComponentType } from 'react';
import { Navigate, type RouteObject } from 'react-router';
import type { Permission } from '@lotwise/shared';
import { PageSpinner } from '../components/ui/spinner';
import { paths } from '../config/paths';
import { ChemicalsListPage } from '../features/chemicals/pages/chemicals-list-page';
import { ChemicalDetailPage } from '../features/chemicals/pages/chemical-detail-page';
import { orderRoutes } from './order-routes';
import { preparationRoutes } from './preparation-routes';
import { RequirePermission, SignedInLayout } from './routes/guards';
import { NotFoundPage, RouteErrorPage } from './routes/status-pages';

/** A page of the stock feature, loaded when first opened. */
function stockPage(
  path: string,
  load: () => Promise<{ Component: ComponentType }>,
  permission: Permission = 'stock.read',
): RouteObject {
  return {
    // The section's own address is its index page.
    ...(path === paths.stock ? { index: true } : { path }),
    lazy: async () => {
      const { Component } = await load();
      return {
        element: (
          <RequirePermission permission={permission}>
            <Component />
          </RequirePermission>
        ),
      };
    },
  };
}

const stockRoutes: RouteObject[] = [
  stockPage(paths.stock, async () => ({
    Component: (await import('../features/stock/pages/stock-overview-page')).StockOverviewPage,
  })),
  stockPage(paths.stockContainers, async () => ({
    Component: (await import('../features/stock/pages/containers-list-page')).ContainersListPage,
  })),
  stockPage(paths.stockContainer(), async () => ({
    Component: (await import('../features/stock/pages/container-page')).ContainerPage,
  })),
  stockPage(paths.stockContainerByLabel(), async () => ({
    Component: (await import('../features/stock/pages/container-page')).ContainerByLabelPage,
  })),
  stockPage(paths.stockChemical(), async () => ({
    Component: (await import('../features/stock/pages/chemical-stock-page')).ChemicalStockPage,
  })),
  stockPage(paths.stockLocations, async () => ({
    Component: (await import('../features/stock/pages/locations-page')).LocationsPage,
  })),
  stockPage(paths.stockLocation(), async () => ({
    Component: (await import('../features/stock/pages/location-page')).LocationPage,
  })),
  stockPage(
    paths.stockStocktake(),
    async () => ({
      Component: (await import('../features/stock/pages/stocktake-page')).StocktakePage,
    }),
    'stock.write',
  ),
  stockPage(paths.stockSegregation, async () => ({
    Component: (await import('../features/stock/pages/segregation-page')).SegregationPage,
  })),
  stockPage(
    paths.stockReceive,
    async () => ({
      Component: (await import('../features/stock/pages/receive-page')).ReceivePage,
    }),
    'stock.write',
  ),
  stockPage(
    paths.stockImport,
    async () => ({
      Component: (await import('../features/imports/pages/import-page')).ImportPage,
    }),
    'stock.write',
  ),
  stockPage(paths.stockLabels, async () => ({
    Component: (await import('../features/stock/pages/labels-page')).LabelsPage,
  })),
];

/** A page of shared purchasing's money and receiving, loaded when first opened. */
function purchasePage(
  path: string,
  load: () => Promise<{ Component: ComponentType }>,
  permission: Permission,
): RouteObject {
  return {
    path,
    lazy: async () => {
      const { Component } = await load();
      return {
        element: (
          <RequirePermission permission={permission}>
            <Component />
          </RequirePermission>
        ),
      };
    },
  };
}

const purchaseRoutes: RouteObject[] = [
  purchasePage(
    paths.purchases,
    async () => ({
      Component: (await import('../features/purchases/pages/my-purchases-page')).MyPurchasesPage,
    }),
    'orders.join',
  ),
  purchasePage(
    paths.orderReceipt(),
    async () => ({
      Component: (await import('../features/purchases/pages/receipt-page')).ReceiptPage,
    }),
    'orders.join',
  ),
  purchasePage(
    paths.orderMoney(),
    async () => ({
      Component: (await import('../features/purchases/pages/order-money-page')).OrderMoneyPage,
    }),
    'orders.manage',
  ),
  purchasePage(
    paths.orderReceive(),
    async () => ({
      Component: (await import('../features/purchases/pages/receive-order-page')).ReceiveOrderPage,
    }),
    'orders.manage',
  ),
];

/** Every screen of the web app. Forms and admin pages load their code when first opened. */
export const routes: RouteObject[] = [
  {
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <PageSpinner label="Opening Lotwise…" />,
    children: [
      {
        path: paths.signIn,
        lazy: async () => ({
          Component: (await import('../features/auth/pages/sign-in-page')).SignInPage,
        }),
      },
      {
        path: paths.invite(),
        lazy: async () => ({
          Component: (await import('../features/auth/pages/accept-invite-page')).AcceptInvitePage,
        }),
      },
      {
        element: <SignedInLayout />,
        children: [
          { index: true, element: <Navigate to={paths.chemicals} replace /> },
          {
            path: paths.chemicals,
            element: (
              <RequirePermission permission="chemicals.read">
                <ChemicalsListPage />
              </RequirePermission>
            ),
          },
          {
            path: paths.chemicalNew,
            lazy: async () => {
              const { ChemicalCreatePage } =
                await import('../features/chemicals/pages/chemical-create-page');
              return {
                element: (
                  <RequirePermission permission="chemicals.write">
                    <ChemicalCreatePage />
                  </RequirePermission>
                ),
              };
            },
          },
          {
            path: paths.chemical(),
            element: (
              <RequirePermission permission="chemicals.read">
                <ChemicalDetailPage />
              </RequirePermission>
            ),
          },
          {
            path: paths.chemicalEdit(),
            lazy: async () => {
              const { ChemicalEditPage } =
                await import('../features/chemicals/pages/chemical-edit-page');
              return {
                element: (
                  <RequirePermission permission="chemicals.write">
                    <ChemicalEditPage />
                  </RequirePermission>
                ),
              };
            },
          },
          {
            path: paths.stock,
            element: <RequirePermission permission="stock.read" />,
            children: [
              {
                lazy: async () => ({
                  Component: (await import('../features/stock/components/stock-section-nav'))
                    .StockLayout,
                }),
                children: stockRoutes,
              },
            ],
          },
          {
            path: paths.preparations,
            element: <RequirePermission permission="procedures.read" />,
            children: [
              {
                lazy: async () => ({
                  Component: (await import('../features/preparations/components/section-nav'))
                    .PreparationsLayout,
                }),
                children: preparationRoutes,
              },
            ],
          },
          // The runs list moved under Preparations; old links still arrive.
          { path: '/runs', element: <Navigate to={paths.runs} replace /> },
          ...orderRoutes,
          {
            path: paths.restock,
            lazy: async () => {
              const { RestockPage } = await import('../features/reorder/pages/restock-page');
              return {
                element: (
                  <RequirePermission permission="orders.read">
                    <RestockPage />
                  </RequirePermission>
                ),
              };
            },
          },
          ...purchaseRoutes,
          {
            path: paths.alerts,
            lazy: async () => {
              const { AlertsPage } = await import('../features/alerts/pages/alerts-page');
              return {
                element: (
                  <RequirePermission permission="alerts.read">
                    <AlertsPage />
                  </RequirePermission>
                ),
              };
            },
          },
          {
            // every e-mail's footer links here, so any signed-in person may open it
            path: paths.alertPreferences,
            lazy: async () => ({
              Component: (await import('../features/alerts/pages/preferences-page'))
                .AlertPreferencesPage,
            }),
          },
          {
            path: paths.account,
            lazy: async () => ({
              Component: (await import('../features/auth/pages/account-page')).AccountPage,
            }),
          },
          {
            path: paths.suppliers,
            lazy: async () => {
              const { SuppliersListPage } =
                await import('../features/suppliers/pages/suppliers-list-page');
              return {
                element: (
                  <RequirePermission permission="orders.read">
                    <SuppliersListPage />
                  </RequirePermission>
                ),
              };
            },
          },
          {
            path: paths.supplier(),
            lazy: async () => {
              const { SupplierPage } = await import('../features/suppliers/pages/supplier-page');
              return {
                element: (
                  <RequirePermission permission="orders.read">
                    <SupplierPage />
                  </RequirePermission>
                ),
              };
            },
          },
          {
            path: paths.adminOutbox,
            lazy: async () => {
              const { OutboxPage } = await import('../features/alerts/pages/outbox-page');
              return {
                element: (
                  <RequirePermission permission="outbox.manage">
                    <OutboxPage />
                  </RequirePermission>
                ),
              };
            },
          },
          {
            path: paths.adminUsers,
            lazy: async () => {
              const { UsersPage } = await import('../features/users/pages/users-page');
              return {
                element: (
                  <RequirePermission permission="users.manage">
                    <UsersPage />
                  </RequirePermission>
                ),
              };
            },
          },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
];
