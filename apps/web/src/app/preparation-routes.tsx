import type { ComponentType } from 'react';
import { Navigate, type RouteObject } from 'react-router';
import type { Permission } from '@lotwise/shared';
import { paths } from '../config/paths';
import { lazyPage } from './lazy-page';

/** A page of preparations, loaded when first opened. */
function preparationPage(
  path: string,
  load: () => Promise<ComponentType>,
  permission: Permission = 'procedures.read',
): RouteObject {
  return lazyPage(path, load, permission);
}

const pages = {
  procedures: () => import('../features/preparations/pages/procedures-list-page'),
  procedure: () => import('../features/preparations/pages/procedure-page'),
  procedureForms: () => import('../features/preparations/pages/procedure-form-pages'),
  plans: () => import('../features/preparations/pages/plans-list-page'),
  planNew: () => import('../features/preparations/pages/plan-new-page'),
  plan: () => import('../features/preparations/pages/plan-page'),
  dispensing: () => import('../features/preparations/pages/dispensing-page'),
  runs: () => import('../features/preparations/pages/runs-list-page'),
  runNew: () => import('../features/preparations/pages/run-new-page'),
  run: () => import('../features/preparations/pages/run-page'),
  runRecord: () => import('../features/preparations/pages/run-record-page'),
  runBench: () => import('../features/run-bench/pages/run-bench-page'),
  runNotebook: () => import('../features/run-notebook/pages/run-notebook-page'),
  usage: () => import('../features/preparations/pages/chemical-usage-page'),
  provenance: () => import('../features/preparations/pages/lot-provenance-page'),
} satisfies Record<string, () => Promise<unknown>>;

/**
 * Procedures, session plans, dispensing sheets, runs and their history, under one section
 * with its own navigation. Making plans and recording runs needs `runs.record`.
 */
export const preparationRoutes: RouteObject[] = [
  { index: true, element: <Navigate to={paths.procedures} replace /> },
  preparationPage(paths.procedures, async () => (await pages.procedures()).ProceduresListPage),
  preparationPage(
    paths.procedureNew,
    async () => (await pages.procedureForms()).ProcedureCreatePage,
    'procedures.write',
  ),
  preparationPage(paths.procedure(), async () => (await pages.procedure()).ProcedurePage),
  preparationPage(
    paths.procedureEdit(),
    async () => (await pages.procedureForms()).ProcedureEditPage,
    'procedures.write',
  ),
  preparationPage(paths.plans, async () => (await pages.plans()).PlansListPage),
  preparationPage(paths.planNew, async () => (await pages.planNew()).PlanNewPage, 'runs.record'),
  preparationPage(paths.plan(), async () => (await pages.plan()).PlanPage),
  preparationPage(paths.planDispensing(), async () => (await pages.dispensing()).DispensingPage),
  preparationPage(paths.runs, async () => (await pages.runs()).RunsListPage),
  preparationPage(paths.runNew, async () => (await pages.runNew()).RunNewPage, 'runs.record'),
  preparationPage(paths.run(), async () => (await pages.run()).RunPage),
  preparationPage(
    paths.runRecord(),
    async () => (await pages.runRecord()).RunRecordPage,
    'runs.record',
  ),
  preparationPage(paths.runBench(), async () => (await pages.runBench()).RunBenchPage),
  preparationPage(paths.runNotebook(), async () => (await pages.runNotebook()).RunNotebookPage),
  preparationPage(paths.chemicalUsage(), async () => (await pages.usage()).ChemicalUsagePage),
  preparationPage(
    paths.lotProvenance(),
    async () => (await pages.provenance()).LotProvenancePage,
    'stock.read',
  ),
];
