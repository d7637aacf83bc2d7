import { inspectionSummarySchema } from '@lotwise/shared';
import { idParamsSchema } from '../../lib/validate';
import { defineRoute } from '../../lib/route-table';
import type { InspectionService } from './inspection.service';

export function inspectionRoutes(inspection: InspectionService) {
  return [
    defineRoute({
      method: 'get',
      path: '/api/lab-areas/:id/inspection',
      access: 'stock.read',
      summary:
        'Inspection summary of a lab area: flammable liquids against limits, watched chemicals, waste on hand and storage conflicts, each with its rule sets',
      response: { schema: inspectionSummarySchema },
      params: idParamsSchema,
      handle: async ({ params, res }) => {
        res.json(await inspection.summary(params.id));
      },
    }),
  ];
}
