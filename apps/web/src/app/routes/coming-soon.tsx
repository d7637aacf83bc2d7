import { Construction } from 'lucide-react';

export interface ComingCapability {
  title: string;
  summary: string;
  willDo: string[];
}

/** Capabilities that are planned but not built yet, described honestly. */
export const comingCapabilities = {
  preparations: {
    title: 'Preparations',
    summary: 'Plan a procedure at the scale you will run it.',
    willDo: [
      'Scale a written procedure by a factor, or to a target amount of limiting reagent or product.',
      'Check every reagent against stock: enough, in date, of the right grade, and where it is.',
      'Reserve containers for a planned session so nobody else counts on them.',
    ],
  },
  runs: {
    title: 'Runs',
    summary: 'Record what really happened at the bench.',
    willDo: [
      'Draw the amounts actually used from named containers.',
      'Log the crude and purified product as a new lot, with percent yield against theory.',
      'Keep observations such as a melting range next to the literature value.',
    ],
  },
  orders: {
    title: 'Orders',
    summary: 'Buy before things run out, and share the cost.',
    willDo: [
      'Reorder suggestions from each chemical’s reorder point and use rate.',
      'Shared orders that pool small purchases and hazardous-goods shipping.',
      'A fair split of the bill, paid online, with restricted items approved by a manager.',
    ],
  },
  alerts: {
    title: 'Alerts',
    summary: 'Be told in time.',
    willDo: [
      'Low-stock warnings when a chemical falls to its reorder point.',
      'Reminders before lots expire.',
      'Peroxide-test reminders for opened peroxide formers, by class.',
    ],
  },
} satisfies Record<string, ComingCapability>;

export function ComingSoonPage({ capability }: { capability: ComingCapability }) {
  return (
    <div className="flex max-w-2xl flex-col gap-4">
      <h1 className="text-xl font-semibold text-ink-900">{capability.title}</h1>
      <div className="rounded-lg border border-ink-200 bg-white p-5">
        <p className="flex items-center gap-2 font-semibold text-ink-900">
          <Construction aria-hidden="true" className="size-5 text-accent-600" />
          This part of Lotwise is not built yet
        </p>
        <p className="mt-2 text-sm text-ink-700">
          {capability.summary} When it is ready, it will let you:
        </p>
        <ul className="mt-2 list-disc space-y-1 pl-5 text-sm text-ink-800">
          {capability.willDo.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
        <p className="mt-4 text-sm text-ink-600">
          Nothing on this page is sample data; it will show your lab’s own records once the feature
          exists.
        </p>
      </div>
    </div>
  );
}
