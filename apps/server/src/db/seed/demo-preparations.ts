import { addDays } from '@lotwise/chem';
import {
  procedureCreateSchema,
  runRecordSchema,
  todayIso,
  type Chemical,
  type RunRecord,
  type User,
} from '@lotwise/shared';
import type { Repositories } from '../store';
import { insertProcedure } from '../../modules/procedures/procedures.service';
import { openRun, recordRunWith } from '../../modules/runs/runs.service';
import { presentUser } from '../../modules/users/users.service';
import { demoProcedures } from './demo-procedures';
import {
  aspirinTimeline,
  dibenzalacetoneTimeline,
  seedRunTimeline,
  type DemoTimelineEntry,
} from './demo-timelines';

export { preparedOnlyChemicals } from './demo-procedures';

type DrawSpec = [chemical: string, amount: number, unit: string, weigh?: boolean];

interface RunSpec {
  procedure: number;
  daysAgo: number;
  factor: number;
  by: 'manager' | 'member';
  lines: (DrawSpec | null)[];
  extra?: (DrawSpec & { 4?: string })[];
  crudeMassG?: number;
  portions: [label: string, grams: number][];
  melting?: [number, number];
  appearance?: string;
  notes?: string;
  volumeProduct?: boolean;
  /** What happened at the bench, step by step (two runs have one). */
  timeline?: DemoTimelineEntry[];
}

/** Eleven recorded runs with realistic yields, oldest first (invented). */
const demoRuns: RunSpec[] = [
  // Aspirin: 2.0 g SA -> 2.609 g theoretical.
  {
    procedure: 0,
    daysAgo: 120,
    factor: 1,
    by: 'member',
    lines: [
      ['Salicylic acid', 2.0, 'g'],
      ['Acetic anhydride', 5.0, 'mL'],
      ['Phosphoric acid 85 %', 0.25, 'mL'],
      ['Water, deionised', 50, 'mL'],
    ],
    extra: [['Ethanol', 8, 'mL']],
    crudeMassG: 2.52,
    portions: [['first crop', 2.05]],
    melting: [134, 135.5],
    appearance: 'white needles',
  },
  {
    procedure: 1,
    daysAgo: 110,
    factor: 1,
    by: 'member',
    lines: [
      ['Isoamyl alcohol', 5.0, 'mL'],
      ['Acetic acid, glacial', 7.0, 'mL'],
      ['Sulfuric acid 98 %', 1.0, 'mL'],
      ['Sodium bicarbonate', 2.5, 'g'],
    ],
    portions: [['distillate', 3.55]],
    appearance: 'colourless liquid, banana smell',
    volumeProduct: true,
  },
  {
    procedure: 2,
    daysAgo: 100,
    factor: 0.3,
    by: 'manager',
    lines: [
      ['Sodium hydroxide', 3.0, 'g', true],
      ['Water, deionised', 75, 'mL'],
    ],
    portions: [['stock bottle', 73.5]],
    appearance: 'clear, colourless',
    volumeProduct: true,
    notes: 'Made up to 75 mL; 1.5 mL lost rinsing the flask.',
  },
  {
    procedure: 3,
    daysAgo: 90,
    factor: 1,
    by: 'member',
    lines: [
      ['Benzaldehyde', 2.0, 'mL'],
      ['Acetone', 0.7, 'mL'],
      ['Sodium hydroxide solution 1 M', 20, 'mL'],
      ['Ethanol', 15, 'mL'],
      ['Water, deionised', 50, 'mL'],
    ],
    extra: [['Ethanol', 10, 'mL']],
    crudeMassG: 1.86,
    portions: [['first crop', 1.52]],
    melting: [109, 111],
    appearance: 'pale yellow plates',
  },
  {
    procedure: 0,
    daysAgo: 85,
    factor: 1,
    by: 'member',
    lines: [
      ['Salicylic acid', 2.0, 'g', true],
      ['Acetic anhydride', 5.0, 'mL'],
      ['Phosphoric acid 85 %', 0.25, 'mL'],
      ['Water, deionised', 50, 'mL'],
    ],
    extra: [['Ethanol', 8, 'mL']],
    portions: [
      ['first crop', 1.98],
      ['second crop (mother liquor)', 0.21],
    ],
    melting: [133.5, 135],
    appearance: 'white crystals; second crop off-white',
  },
  {
    procedure: 1,
    daysAgo: 70,
    factor: 1,
    by: 'manager',
    lines: [
      ['Isoamyl alcohol', 5.0, 'mL'],
      ['Acetic acid, glacial', 7.0, 'mL'],
      ['Sulfuric acid 98 %', 1.0, 'mL'],
      ['Sodium bicarbonate', 2.5, 'g'],
    ],
    portions: [['distillate', 3.95]],
    appearance: 'colourless liquid',
    volumeProduct: true,
  },
  {
    procedure: 3,
    daysAgo: 60,
    factor: 1,
    by: 'member',
    lines: [
      ['Benzaldehyde', 2.0, 'mL'],
      ['Acetone', 0.7, 'mL'],
      ['Sodium hydroxide solution 1 M', 20, 'mL'],
      ['Ethanol', 15, 'mL'],
      ['Water, deionised', 50, 'mL'],
    ],
    extra: [['Ethanol', 10, 'mL']],
    portions: [
      ['first crop', 1.71],
      ['second crop (mother liquor)', 0.12],
    ],
    melting: [108, 110.5],
    appearance: 'yellow plates',
  },
  {
    procedure: 0,
    daysAgo: 50,
    factor: 0.5,
    by: 'member',
    timeline: aspirinTimeline,
    lines: [
      ['Salicylic acid', 1.0, 'g'],
      ['Acetic anhydride', 2.5, 'mL'],
      ['Phosphoric acid 85 %', 0.15, 'mL'],
      ['Water, deionised', 25, 'mL'],
    ],
    extra: [['Ethanol', 4, 'mL']],
    portions: [['first crop', 1.14]],
    melting: [135, 136],
    appearance: 'white needles',
  },
  {
    procedure: 1,
    daysAgo: 30,
    factor: 1,
    by: 'member',
    lines: [
      ['Isoamyl alcohol', 5.0, 'mL'],
      ['Acetic acid, glacial', 7.0, 'mL'],
      ['Sulfuric acid 98 %', 1.0, 'mL'],
      ['Sodium bicarbonate', 2.5, 'g'],
    ],
    portions: [['distillate', 3.12]],
    appearance: 'colourless liquid; some lost in the separating funnel',
    volumeProduct: true,
  },
  {
    procedure: 0,
    daysAgo: 20,
    factor: 1,
    by: 'member',
    lines: [
      ['Salicylic acid', 2.01, 'g'],
      ['Acetic anhydride', 5.0, 'mL'],
      ['Phosphoric acid 85 %', 0.25, 'mL'],
      ['Water, deionised', 50, 'mL'],
    ],
    portions: [['first crop (not dried)', 2.76]],
    melting: [128, 133],
    appearance: 'damp white solid',
    notes: 'Weighed straight off the filter: dry it and weigh again.',
  },
  {
    procedure: 3,
    daysAgo: 15,
    factor: 1,
    by: 'manager',
    timeline: dibenzalacetoneTimeline,
    notes:
      'The addition ran warm once (31.5 °C): stopped, ice added to the bath, then on more slowly.',
    lines: [
      ['Benzaldehyde', 2.0, 'mL'],
      ['Acetone', 0.7, 'mL'],
      ['Sodium hydroxide solution 1 M', 20, 'mL'],
      ['Ethanol', 15, 'mL'],
      ['Water, deionised', 50, 'mL'],
    ],
    portions: [['first crop', 1.44]],
    melting: [109.5, 111],
    appearance: 'pale yellow plates',
  },
];

/** Where each product is put away (keys of the demo places). */
const productShelf = ['genA', 'flam1', 'bases', 'genB'];

/**
 * The demo procedures, their runs (drawn from the demo containers through the same code
 * the API uses, so the ledger invariant holds) and one upcoming plan. Deterministic;
 * inside the seed's transaction.
 */
export async function seedDemoPreparations(
  repos: Repositories,
  chemicals: Chemical[],
  people: { id: number; role: string }[],
  places: Map<string, { id: number; path: string }>,
  today = todayIso(),
): Promise<void> {
  const byName = new Map(chemicals.map((c) => [c.name, c]));
  const id = (name: string) => {
    const chemical = byName.get(name);
    if (!chemical) throw new Error(`The demo has no chemical named ${name}`);
    return chemical.id;
  };
  const manager = presentUser(
    (await repos.users.findById(people.find((p) => p.role === 'manager')!.id))!,
  );
  const members = (
    await repos.users.findByIds(people.filter((p) => p.role === 'member').map((p) => p.id))
  ).map(presentUser);
  const procedureIds: number[] = [];
  for (const procedure of demoProcedures(id)) {
    procedureIds.push(
      await insertProcedure(
        repos,
        procedureCreateSchema.parse(procedure),
        manager.id,
        `${addDays(today, -150)}T08:00:00.000Z`,
      ),
    );
  }

  /** The container to draw from on a date: open first, then expiring soonest, enough left. */
  async function containerFor(chemical: string, amount: number, on: string) {
    const rows = await repos.plans.usableContainers([id(chemical)], on);
    const fits = rows
      .filter((row) => row.quantity >= amount + 1e-6)
      .sort(
        (a, b) =>
          (a.status === 'open' ? 0 : 1) - (b.status === 'open' ? 0 : 1) ||
          (a.expiresOn ?? '9999').localeCompare(b.expiresOn ?? '9999') ||
          a.id - b.id,
      );
    if (!fits[0])
      throw new Error(`The demo has no ${amount} of ${chemical} left for a run on ${on}`);
    return fits[0];
  }

  let memberTurn = 0;
  for (const spec of demoRuns) {
    const on = addDays(today, -spec.daysAgo);
    const at = `${on}T14:30:00.000Z`;
    const actor: User = spec.by === 'manager' ? manager : members[memberTurn++ % members.length]!;
    const runId = await openRun(
      repos,
      {
        procedureId: procedureIds[spec.procedure]!,
        scaleFactor: spec.factor,
        notes: spec.notes ?? '',
      },
      actor,
      `${on}T09:00:00.000Z`,
    );
    if (spec.timeline) {
      await seedRunTimeline(repos, runId, spec.timeline, `${on}T09:15:00.000Z`, actor);
    }
    const draw = async ([chemical, amount, unit, weigh]: DrawSpec) => {
      const container = await containerFor(chemical, amount, on);
      const tare = (await repos.containers.findRow(container.id))!.tareMass;
      // Weighed by difference: the bottle's gross mass before and after.
      return weigh && tare !== null
        ? {
            containerId: container.id,
            grossMassBefore: tare + container.quantity,
            grossMassAfter: tare + container.quantity - amount,
            unit: 'g',
          }
        : { containerId: container.id, amount, unit };
    };
    const lines: NonNullable<RunRecord['lines']> = [];
    for (const [lineIndex, line] of spec.lines.entries()) {
      if (line) lines.push({ lineIndex, draws: [await draw(line)] });
    }
    const extraDraws: NonNullable<RunRecord['extraDraws']> = [];
    for (const extra of spec.extra ?? []) {
      extraDraws.push({ ...(await draw(extra)), purpose: 'recrystallization' });
    }
    const location = places.get(productShelf[spec.procedure]!)!;
    await recordRunWith(
      repos,
      runId,
      runRecordSchema.parse({
        performedOn: on,
        lines,
        extraDraws,
        products: [
          {
            crudeMassG: spec.crudeMassG ?? null,
            portions: spec.portions.map(([label, quantity]) => ({
              label,
              quantity,
              unit: spec.volumeProduct && spec.procedure === 2 ? 'mL' : 'g',
              locationId: location.id,
            })),
          },
        ],
        observations: {
          meltingRangeC: spec.melting ? { low: spec.melting[0], high: spec.melting[1] } : null,
          appearance: spec.appearance ?? '',
          notes: '',
        },
      }),
      actor,
      { now: at, today: on },
    );
  }

  // An upcoming session being planned: four benches of the ester at half scale.
  const plannedOn = addDays(today, 6);
  const created = `${today}T08:30:00.000Z`;
  await repos.plans.insert({
    procedureId: procedureIds[1]!,
    scaleFactor: 0.5,
    benches: 4,
    overagePercent: 10,
    plannedOn,
    status: 'draft',
    notes: 'Thursday evening club session.',
    createdById: manager.id,
    runId: null,
    createdAt: created,
    updatedAt: created,
  });
}
