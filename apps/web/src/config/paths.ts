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
  preparations: '/preparations',
  runs: '/runs',
  orders: '/orders',
  alerts: '/alerts',
  adminUsers: '/admin/users',
} as const;
