import type {
  ChemicalUsage,
  LotProvenance,
  Page,
  ProcedureRuns,
  Run,
  RunCreateParsed,
  RunListQuery,
  RunRecordParsed,
  RunSummary,
  User,
} from '@lotwise/shared';
import type { Store } from '../../db/store';
import type { FileStore } from '../../lib/uploads';
import { chemicalUsageOf, lotProvenanceOf, procedureRunsOf } from './run-history';
import { discardRun, openRun } from './run-opening';
import { recordRunWith } from './run-recording';
import { presentRun, runSummaries } from './run-views';

// The demo seed records its runs through the same code as the API.
export { openRun } from './run-opening';
export { recordRunWith } from './run-recording';

/**
 * Runs: opening one (from a plan or ad hoc), recording it in one transaction
 * (run-recording.ts, run-draws.ts), and the views that read them (run-views.ts,
 * run-history.ts).
 */
export function runsService(store: Store, files: FileStore) {
  return {
    async list(query: RunListQuery): Promise<Page<RunSummary>> {
      const { rows, total } = await store.repos.runs.list(query);
      return {
        items: await runSummaries(store.repos, rows),
        total,
        page: query.page,
        pageSize: query.pageSize,
      };
    },

    get: (id: number): Promise<Run> => presentRun(store.repos, id),

    async create(input: RunCreateParsed, actor: User): Promise<Run> {
      const id = await store.transaction((repos) => openRun(repos, input, actor));
      return presentRun(store.repos, id);
    },

    /** Records the run in one transaction; its answer is read after the commit. */
    async record(id: number, input: RunRecordParsed, actor: User): Promise<Run> {
      await store.transaction((repos) => recordRunWith(repos, id, input, actor));
      return presentRun(store.repos, id);
    },

    /** Discards an opened run with its timeline and photos; a recorded one stands (409). */
    async discard(id: number, actor: User): Promise<void> {
      const photos = await store.transaction((repos) => discardRun(repos, id, actor));
      for (const storedName of photos) await files.remove(storedName);
    },

    procedureRuns: (procedureId: number): Promise<ProcedureRuns> =>
      procedureRunsOf(store.repos, procedureId),

    chemicalUsage: (chemicalId: number): Promise<ChemicalUsage> =>
      chemicalUsageOf(store.repos, chemicalId),

    lotProvenance: (lotId: number): Promise<LotProvenance> => lotProvenanceOf(store.repos, lotId),
  };
}
export type RunsService = ReturnType<typeof runsService>;
