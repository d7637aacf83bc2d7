import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { ExternalLink } from 'lucide-react';
import { can, type Permission } from '@lotwise/shared';
import { ShortcutList } from '../../../components/shortcuts/shortcut-list';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { Spinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useCurrentUser } from '../../../lib/auth';
import { shortcutsFor } from '../../../lib/shortcuts';
import { openApiUrl, operationsOf, useOpenApiDocument } from '../api';
import { ApiOperations } from '../components/api-operations';

interface Job {
  title: string;
  to: string;
  permission: Permission;
  steps: ReactNode;
}

const jobs: Job[] = [
  {
    title: 'Check stock before a preparation',
    to: paths.planNew,
    permission: 'runs.record',
    steps:
      'Plan the session: pick the procedure, the scale and the number of benches. The plan checks every reagent against what is in stock, in date, and shows what is short and where to take it from.',
  },
  {
    title: 'Record a run',
    to: paths.runNew,
    permission: 'runs.record',
    steps:
      'Open a run from its plan (or from a procedure), then enter what was really drawn from which container, the product’s mass and observations. The yield is worked out for you.',
  },
  {
    title: 'Record a draw at the shelf',
    to: paths.stockContainers,
    permission: 'stock.draw',
    steps:
      'Scan the container’s label or type its code (LW-00042) in the search at the top, then record what you took — or put the container on the balance and type its gross mass.',
  },
  {
    title: 'Act on a low-stock e-mail',
    to: paths.restock,
    permission: 'orders.read',
    steps:
      'The e-mail links to the chemical. Restock lists what is below its reorder point and suggests packs; a shared order lets several people buy together and split the bill.',
  },
  {
    title: 'Receive a delivery',
    to: paths.stockReceive,
    permission: 'stock.write',
    steps:
      'Enter the lot (supplier, lot number, expiry) and its containers, then print their labels.',
  },
  {
    title: 'Look up a chemical’s hazards',
    to: paths.chemicals,
    permission: 'chemicals.read',
    steps:
      'Every chemical shows its GHS pictograms, H-statements, storage group and, when uploaded, its SDS.',
  },
];

function Section({ title, id, children }: { title: string; id: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-3">
      <h2 id={id} className="text-base font-semibold text-ink-900">
        {title}
      </h2>
      {children}
    </section>
  );
}

function ApiSection() {
  const document = useOpenApiDocument();
  return (
    <Section title="The API" id="help-api">
      <p className="max-w-3xl text-sm text-ink-700">
        Everything on these pages goes through Lotwise’s JSON API, so other tools can use it too.
        Its contract is an OpenAPI 3.1 document generated from the same schemas the server checks
        every request with:{' '}
        <a
          href={openApiUrl}
          target="_blank"
          rel="noreferrer"
          className="inline-flex items-center gap-1 font-mono font-medium text-accent-700 underline underline-offset-2"
        >
          {openApiUrl}
          <ExternalLink aria-hidden="true" className="size-3.5" />
          <span className="sr-only">(opens in a new tab)</span>
        </a>
        . Sign in with <code className="font-mono">POST /api/auth/login</code>; the session is a
        cookie. Each operation below says who may call it: public, anyone signed in, or the
        permission it needs.
      </p>
      {document.isPending ? (
        <p className="flex items-center gap-2 text-sm text-ink-600">
          <Spinner size="sm" /> Loading the API document…
        </p>
      ) : document.isError ? (
        <ErrorState
          title="The API document could not be loaded"
          error={document.error}
          onRetry={() => void document.refetch()}
        />
      ) : (
        <ApiOperations operations={operationsOf(document.data)} />
      )}
    </Section>
  );
}

/** What Lotwise is, the everyday jobs, the keyboard shortcuts and the API. */
export function HelpPage() {
  const { data: user } = useCurrentUser();
  const role = user?.role ?? 'viewer';

  return (
    <div className="flex flex-col gap-8">
      <header className="max-w-3xl">
        <h1 className="text-xl font-semibold text-ink-900">Help</h1>
        <p className="mt-1 text-sm text-ink-700">
          Lotwise runs a small chemistry lab’s stockroom: chemicals and their hazards, lots and
          labelled containers with a ledger of every gram drawn, preparations planned against the
          stock, runs with their yields, restocking and shared orders.
        </p>
      </header>

      <Notice tone="warn" title="Safety comes first">
        Lotwise shows hazards wherever a chemical appears, but nothing it shows is safety approval.
        The SDS, local regulations and licensed practice take precedence.
      </Notice>

      <Section title="Everyday jobs" id="help-jobs">
        <ul className="grid gap-3 md:grid-cols-2">
          {jobs.map((job) => (
            <li key={job.title} className="rounded-lg border border-ink-200 bg-white px-4 py-3">
              <h3 className="text-sm font-semibold text-ink-900">
                {can(role, job.permission) ? (
                  <Link to={job.to} className="text-accent-700 underline underline-offset-2">
                    {job.title}
                  </Link>
                ) : (
                  job.title
                )}
              </h3>
              <p className="mt-1 text-sm text-ink-700">{job.steps}</p>
              {!can(role, job.permission) && (
                <p className="mt-1 text-xs text-ink-600">Your role cannot do this.</p>
              )}
            </li>
          ))}
        </ul>
      </Section>

      <Section title="Keyboard shortcuts" id="help-shortcuts">
        <p className="max-w-3xl text-sm text-ink-700">
          Press a key anywhere outside a text field; <kbd className="font-mono">?</kbd> shows this
          list on any page. Tab and Shift+Tab move through everything else.
        </p>
        <div className="max-w-2xl rounded-lg border border-ink-200 bg-white px-4">
          <ShortcutList items={shortcutsFor(role)} />
        </div>
      </Section>

      <ApiSection />
    </div>
  );
}
