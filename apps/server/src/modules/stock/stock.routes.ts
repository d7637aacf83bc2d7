import {
  searchQuerySchema,
  stockHistoryQuerySchema,
  stockListQuerySchema,
  stocktakeCreateSchema,
  stocktakeExpectedQuerySchema,
  stocktakeListQuerySchema,
} from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { StockService } from './stock.service';

export function stockRoutes(stock: StockService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/stock',
      access: 'stock.read',
      query: stockListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await stock.overview(query));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/search',
      access: 'stock.read',
      query: searchQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await stock.search(query.q, query.limit));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/chemicals/:id/stock-history',
      access: 'stock.read',
      params: idParamsSchema,
      query: stockHistoryQuerySchema,
      handle: async ({ params, query, res }) => {
        res.json(await stock.history(params.id, query.days));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/locations/:id/stocktake',
      access: 'stock.write',
      params: idParamsSchema,
      query: stocktakeExpectedQuerySchema,
      handle: async ({ params, query, res }) => {
        res.json(await stock.expected(params.id, query.includeSublocations));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/stocktakes',
      access: 'stock.read',
      query: stocktakeListQuerySchema,
      handle: async ({ query, res }) => {
        res.json(await stock.listStocktakes(query));
      },
    }),
    defineRoute({
      method: 'post',
      path: '/api/stocktakes',
      access: 'stock.write',
      body: stocktakeCreateSchema,
      handle: async ({ body, res, actor }) => {
        res.status(201).json(await stock.recordStocktake(body, actor()));
      },
    }),
    defineRoute({
      method: 'get',
      path: '/api/stocktakes/:id',
      access: 'stock.read',
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await stock.getStocktake(params.id));
      },
    }),
  ];
}
