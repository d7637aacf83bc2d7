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
  stockReceive: '/stock/receive',
  stockImport: '/stock/import',
  /** `?ids=1,2,3` or `?labelCodes=LW-00001,LW-00002`. */
  stockLabels: '/stock/labels',
  preparations: '/preparations',
  runs: '/runs',
  orders: '/orders',
  alerts: '/alerts',
  adminUsers: '/admin/users',
} as const;
