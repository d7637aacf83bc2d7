import { Navigate, type RouteObject } from 'react-router';
import { PageSpinner } from '../components/ui/spinner';
import { paths } from '../config/paths';
import { lazyPage } from './lazy-page';
import { orderRoutes } from './order-routes';
import { preparationRoutes } from './preparation-routes';
import { RequirePermission } from './routes/guards';
import { NotFoundPage, RouteErrorPage } from './routes/status-pages';

/** Pages of the stock section (the section's own address is its index page). */
const stockRoutes: RouteObject[] = [
  lazyPage(
    { index: true },
    async () => (await import('../features/stock/pages/stock-overview-page')).StockOverviewPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockContainers,
    async () => (await import('../features/stock/pages/containers-list-page')).ContainersListPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockContainer(),
    async () => (await import('../features/stock/pages/container-page')).ContainerPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockContainerByLabel(),
    async () => (await import('../features/stock/pages/container-page')).ContainerByLabelPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockChemical(),
    async () => (await import('../features/stock/pages/chemical-stock-page')).ChemicalStockPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockLocations,
    async () => (await import('../features/stock/pages/locations-page')).LocationsPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockLocation(),
    async () => (await import('../features/stock/pages/location-page')).LocationPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockStocktake(),
    async () => (await import('../features/stock/pages/stocktake-page')).StocktakePage,
    'stock.write',
  ),
  lazyPage(
    paths.stockSegregation,
    async () => (await import('../features/stock/pages/segregation-page')).SegregationPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockLabAreas,
    async () => (await import('../features/lab-areas/pages/lab-areas-page')).LabAreasPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockLabArea(),
    async () => (await import('../features/lab-areas/pages/lab-area-page')).LabAreaPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockLabAreaInspection(),
    async () =>
      (await import('../features/inspection/pages/inspection-summary-page')).InspectionSummaryPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockRuleSets,
    async () => (await import('../features/lab-areas/pages/rule-sets-page')).RuleSetsPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockRuleSetNew,
    async () => (await import('../features/lab-areas/pages/rule-set-form-page')).RuleSetNewPage,
    'stock.write',
  ),
  lazyPage(
    paths.stockRuleSet(),
    async () => (await import('../features/lab-areas/pages/rule-set-page')).RuleSetPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockRuleSetEdit(),
    async () => (await import('../features/lab-areas/pages/rule-set-form-page')).RuleSetEditPage,
    'stock.write',
  ),
  lazyPage(
    paths.stockWaste,
    async () => (await import('../features/waste/pages/waste-page')).WastePage,
    'stock.read',
  ),
  lazyPage(
    paths.stockWasteContainer(),
    async () => (await import('../features/waste/pages/waste-container-page')).WasteContainerPage,
    'stock.read',
  ),
  lazyPage(
    paths.stockReceive,
    async () => (await import('../features/stock/pages/receive-page')).ReceivePage,
    'stock.write',
  ),
  lazyPage(
    paths.stockImport,
    async () => (await import('../features/imports/pages/import-page')).ImportPage,
    'stock.write',
  ),
  lazyPage(
    paths.stockLabels,
    async () => (await import('../features/stock/pages/labels-page')).LabelsPage,
    'stock.read',
  ),
];

/** Shared purchasing's money and receiving. */
const purchaseRoutes: RouteObject[] = [
  lazyPage(
    paths.purchases,
    async () => (await import('../features/purchases/pages/my-purchases-page')).MyPurchasesPage,
    'orders.join',
  ),
  lazyPage(
    paths.orderReceipt(),
    async () => (await import('../features/purchases/pages/receipt-page')).ReceiptPage,
    'orders.join',
  ),
  lazyPage(
    paths.orderMoney(),
    async () => (await import('../features/purchases/pages/order-money-page')).OrderMoneyPage,
    'orders.manage',
  ),
  lazyPage(
    paths.orderReceive(),
    async () => (await import('../features/purchases/pages/receive-order-page')).ReceiveOrderPage,
    'orders.manage',
  ),
];

/**
 * Every screen of the web app. Each page's code loads when it is first opened, and the
 * signed-in layout (header, navigation, search) with the first of them: the sign-in page
 * carries none of it.
 */
export const routes: RouteObject[] = [
  {
    errorElement: <RouteErrorPage />,
    hydrateFallbackElement: <PageSpinner label="Opening Lotwise…" />,
    children: [
      lazyPage(
        paths.signIn,
        async () => (await import('../features/auth/pages/sign-in-page')).SignInPage,
      ),
      lazyPage(
        paths.invite(),
        async () => (await import('../features/auth/pages/accept-invite-page')).AcceptInvitePage,
      ),
      {
        lazy: async () => ({
          Component: (await import('./routes/signed-in-layout')).SignedInLayout,
        }),
        children: [
          lazyPage(
            { index: true },
            async () => (await import('../features/today/pages/today-page')).TodayPage,
          ),
          lazyPage(
            paths.chemicals,
            async () =>
              (await import('../features/chemicals/pages/chemicals-list-page')).ChemicalsListPage,
            'chemicals.read',
          ),
          lazyPage(
            paths.chemicalNew,
            async () =>
              (await import('../features/chemicals/pages/chemical-create-page')).ChemicalCreatePage,
            'chemicals.write',
          ),
          lazyPage(
            paths.chemical(),
            async () =>
              (await import('../features/chemicals/pages/chemical-detail-page')).ChemicalDetailPage,
            'chemicals.read',
          ),
          lazyPage(
            paths.chemicalEdit(),
            async () =>
              (await import('../features/chemicals/pages/chemical-edit-page')).ChemicalEditPage,
            'chemicals.write',
          ),
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
          lazyPage(
            paths.restock,
            async () => (await import('../features/reorder/pages/restock-page')).RestockPage,
            'orders.read',
          ),
          ...purchaseRoutes,
          lazyPage(
            paths.alerts,
            async () => (await import('../features/alerts/pages/alerts-page')).AlertsPage,
            'alerts.read',
          ),
          // every e-mail's footer links here, so any signed-in person may open it
          lazyPage(
            paths.alertPreferences,
            async () =>
              (await import('../features/alerts/pages/preferences-page')).AlertPreferencesPage,
          ),
          lazyPage(
            paths.account,
            async () => (await import('../features/auth/pages/account-page')).AccountPage,
          ),
          lazyPage(
            paths.help,
            async () => (await import('../features/help/pages/help-page')).HelpPage,
          ),
          lazyPage(
            paths.suppliers,
            async () =>
              (await import('../features/suppliers/pages/suppliers-list-page')).SuppliersListPage,
            'orders.read',
          ),
          lazyPage(
            paths.supplier(),
            async () => (await import('../features/suppliers/pages/supplier-page')).SupplierPage,
            'orders.read',
          ),
          lazyPage(
            paths.adminOutbox,
            async () => (await import('../features/alerts/pages/outbox-page')).OutboxPage,
            'outbox.manage',
          ),
          lazyPage(
            paths.adminUsers,
            async () => (await import('../features/users/pages/users-page')).UsersPage,
            'users.manage',
          ),
          lazyPage(
            paths.adminWatchLists,
            async () =>
              (await import('../features/watch-lists/pages/watch-lists-page')).WatchListsPage,
            'users.manage',
          ),
          lazyPage(
            paths.adminWatchedChemicals,
            async () =>
              (await import('../features/watch-lists/pages/watched-chemicals-page'))
                .WatchedChemicalsPage,
            'users.manage',
          ),
          lazyPage(
            paths.adminBackups,
            async () => (await import('../features/backups/pages/backups-page')).BackupsPage,
            'backups.manage',
          ),
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
];
