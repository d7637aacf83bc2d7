import {
  catalogItemCreateSchema,
  catalogItemListQuerySchema,
  catalogItemPatchSchema,
  supplierCreateSchema,
  supplierListQuerySchema,
  supplierPatchSchema,
} from '@lotwise/shared';
import { defineRoute } from '../../lib/route-table';
import { idParamsSchema } from '../../lib/validate';
import type { SuppliersService } from './suppliers.service';

/** Suppliers and their catalogue: read with `orders.read`, changed with `orders.manage`. */
export function supplierRoutes(suppliers: SuppliersService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/suppliers',
      access: 'orders.read',
      query: supplierListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await suppliers.listSuppliers(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/suppliers',
      access: 'orders.manage',
      body: supplierCreateSchema,
      handle: async ({ body, res }) => {
        res.status(201).json(await suppliers.createSupplier(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/suppliers/:id',
      access: 'orders.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await suppliers.getSupplier(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/suppliers/:id',
      access: 'orders.manage',
      params: idParamsSchema,
      body: supplierPatchSchema,
      handle: async ({ params, body, res }) => {
        res.json(await suppliers.updateSupplier(params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/suppliers/:id',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await suppliers.removeSupplier(params.id);
        res.status(204).end();
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/catalog-items',
      access: 'orders.read',
      query: catalogItemListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await suppliers.listItems(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/catalog-items',
      access: 'orders.manage',
      body: catalogItemCreateSchema,
      handle: async ({ body, res }) => {
        res.status(201).json(await suppliers.createItem(body));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/catalog-items/:id',
      access: 'orders.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await suppliers.getItem(params.id));
      },
    }),
    defineRoute({
      method: 'patch',
      path: '/api/catalog-items/:id',
      access: 'orders.manage',
      params: idParamsSchema,
      body: catalogItemPatchSchema,
      handle: async ({ params, body, res }) => {
        res.json(await suppliers.updateItem(params.id, body));
      },
    }),
    defineRoute({
      method: 'delete',
      path: '/api/catalog-items/:id',
      access: 'orders.manage',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        await suppliers.removeItem(params.id);
        res.status(204).end();
      },
    }),
  ];
}
