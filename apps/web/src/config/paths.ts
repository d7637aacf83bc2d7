/** Every route of the web app in one place, so links and the router agree. */
export const paths = {
  home: '/',
  signIn: '/sign-in',
  invite: (token = ':token') => `/invite/${token}`,
  chemicals: '/chemicals',
  chemical: (id: number | string = ':id') => `/chemicals/${id}`,
  chemicalNew: '/chemicals/new',
  chemicalEdit: (id: number | string = ':id') => `/chemicals/${id}/edit`,
  stock: '/stock',
  stockContainers: '/stock/containers',
  stockContainer: (id: number | string = ':id') => `/stock/containers/${id}`,
  /** A label code as printed or scanned, e.g. `/stock/c/LW-00042`. */
  stockContainerByLabel: (labelCode?: string) =>
    labelCode === undefined ? '/stock/c/:labelCode' : `/stock/c/${encodeURIComponent(labelCode)}`,
  stockChemical: (id: number | string = ':id') => `/stock/chemicals/${id}`,
  stockLocations: '/stock/locations',
  stockLocation: (id: number | string = ':id') => `/stock/locations/${id}`,
  stockStocktake: (id: number | string = ':id') => `/stock/locations/${id}/stocktake`,
  stockSegregation: '/stock/segregation',
  /** Places marked as lab areas, each with its flammable-liquid limits. */
  stockLabAreas: '/stock/lab-areas',
  stockLabArea: (id: number | string = ':id') => `/stock/lab-areas/${id}`,
  /** A lab area's one-page summary for an inspection (print view). */
  stockLabAreaInspection: (id: number | string = ':id') => `/stock/lab-areas/${id}/inspection`,
  /** The published limits Lotwise checks rooms against, and a lab's own sets. */
  stockRuleSets: '/stock/rule-sets',
  /** `?from=<id>` copies a set into the form. */
  stockRuleSetNew: '/stock/rule-sets/new',
  stockRuleSet: (id: number | string = ':id') => `/stock/rule-sets/${id}`,
  stockRuleSetEdit: (id: number | string = ':id') => `/stock/rule-sets/${id}/edit`,
  /** Waste containers by accumulation area, and the pickups. */
  stockWaste: '/stock/waste',
  stockWasteContainer: (id: number | string = ':id') => `/stock/waste/${id}`,
  stockReceive: '/stock/receive',
  stockImport: '/stock/import',
  /** `?ids=1,2,3` or `?labelCodes=LW-00001,LW-00002`. */
  stockLabels: '/stock/labels',
  preparations: '/preparations',
  procedures: '/preparations/procedures',
  procedureNew: '/preparations/procedures/new',
  procedure: (id: number | string = ':id') => `/preparations/procedures/${id}`,
  procedureEdit: (id: number | string = ':id') => `/preparations/procedures/${id}/edit`,
  plans: '/preparations/plans',
  /** `?procedureId=4&factor=0.13` fills the form in. */
  planNew: '/preparations/plans/new',
  plan: (id: number | string = ':id') => `/preparations/plans/${id}`,
  planDispensing: (id: number | string = ':id') => `/preparations/plans/${id}/dispensing`,
  runs: '/preparations/runs',
  /** `?planId=2`, or `?procedureId=1` for a run without a plan. */
  runNew: '/preparations/runs/new',
  run: (id: number | string = ':id') => `/preparations/runs/${id}`,
  runRecord: (id: number | string = ':id') => `/preparations/runs/${id}/record`,
  /** A run in progress at the bench: the current step, timers, readings, notes, photos. */
  runBench: (id: number | string = ':id') => `/preparations/runs/${id}/bench`,
  /** The run as a printable notebook page. */
  runNotebook: (id: number | string = ':id') => `/preparations/runs/${id}/notebook`,
  /** Where a chemical was used in runs and procedures. */
  chemicalUsage: (chemicalId: number | string = ':chemicalId') =>
    `/preparations/usage/${chemicalId}`,
  lotProvenance: (id: number | string = ':id') => `/preparations/lots/${id}/provenance`,
  orders: '/orders',
  orderNew: '/orders/new',
  /** `?paid=<shareId>` or `?cancelled=<shareId>` on return from the checkout page. */
  order: (id: number | string = ':id') => `/orders/${id}`,
  /** Reorder suggestions and members' requests. */
  restock: '/orders/restock',
  suppliers: '/purchasing/suppliers',
  supplier: (id: number | string = ':id') => `/purchasing/suppliers/${id}`,
  /** The price-list import for one supplier: the import page with the supplier chosen. */
  priceListImport: (supplierId: number) => `/stock/import?kind=price-list&supplierId=${supplierId}`,
  /** The signed-in member's shared orders and what they paid. */
  purchases: '/purchases',
  /** A member's receipt for one order (print view). */
  orderReceipt: (id: number | string = ':id') => `/orders/${id}/receipt`,
  /** The coordinator's money summary of one order. */
  orderMoney: (id: number | string = ':id') => `/orders/${id}/money`,
  /** Receiving an ordered delivery into members' containers. */
  orderReceive: (id: number | string = ':id') => `/orders/${id}/receive`,
  alerts: '/alerts',
  alertPreferences: '/alerts/preferences',
  adminOutbox: '/admin/outbox',
  adminUsers: '/admin/users',
  adminBackups: '/admin/backups',
  /** The regulators' lists of restricted and reportable substances the lab follows. */
  adminWatchLists: '/admin/watch-lists',
  /** Holdings and movements of watched chemicals for a period, with a CSV export. */
  adminWatchedChemicals: '/admin/watched-chemicals',
  /** The signed-in person's own account: change password. */
  account: '/account',
  /** What Lotwise is, the everyday jobs, keyboard shortcuts and the API. */
  help: '/help',
} as const;
