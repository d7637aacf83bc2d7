import { Link } from 'react-router';
import { BookOpenCheck, Lock, Plus } from 'lucide-react';
import { roomRulesReminder, ruleSetKindLabels, ruleSetKinds } from '@lotwise/shared';
import { useRuleSets } from '../../../components/room-rules/api';
import { Badge } from '../../../components/ui/badge';
import { buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorState } from '../../../components/ui/error-state';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { useCan } from '../../../lib/auth';

export function RuleSetsPage() {
  const sets = useRuleSets();
  const mayWrite = useCan('stock.write');

  return (
    <div className="flex flex-col gap-5">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-xl font-semibold text-ink-900">Rule sets</h1>
          <p className="text-sm text-ink-600">
            The published limits Lotwise checks rooms and waste against, each with its source and
            edition. Built-in sets cannot be changed: copy one to enter the figures your authority
            set.
          </p>
        </div>
        {mayWrite && (
          <Link to={paths.stockRuleSetNew} className={buttonClasses('secondary')}>
            <Plus aria-hidden="true" className="size-4" />
            New rule set
          </Link>
        )}
      </header>

      {sets.isPending ? (
        <PageSpinner label="Loading the rule sets…" />
      ) : sets.isError ? (
        <ErrorState
          title="The rule sets could not be loaded"
          error={sets.error}
          onRetry={() => void sets.refetch()}
        />
      ) : sets.data.items.length === 0 ? (
        <EmptyState icon={<BookOpenCheck />} title="No rule sets">
          Lotwise ships its built-in sets with the database; ask an admin to check the server.
        </EmptyState>
      ) : (
        ruleSetKinds.map((kind) => {
          const ofKind = sets.data.items.filter((s) => s.kind === kind);
          return (
            <section key={kind} aria-labelledby={`${kind}-heading`} className="flex flex-col gap-2">
              <h2 id={`${kind}-heading`} className="text-base font-semibold">
                {ruleSetKindLabels[kind]}
              </h2>
              {ofKind.length === 0 ? (
                <p className="text-sm text-ink-600">None yet.</p>
              ) : (
                <ul className="flex flex-col divide-y divide-ink-100 rounded-md border border-ink-200">
                  {ofKind.map((set) => (
                    <li
                      key={set.id}
                      className="flex flex-wrap items-center justify-between gap-2 px-3 py-2"
                    >
                      <div>
                        <Link
                          to={paths.stockRuleSet(set.id)}
                          className="font-medium text-accent-700 underline-offset-2 hover:underline"
                        >
                          {set.name}
                        </Link>
                        <p className="text-xs text-ink-600">{set.citation}</p>
                      </div>
                      {set.builtIn ? (
                        <Badge icon={<Lock aria-hidden="true" />}>Built in</Badge>
                      ) : (
                        <Badge tone="accent">Your own</Badge>
                      )}
                    </li>
                  ))}
                </ul>
              )}
            </section>
          );
        })
      )}
      <p className="text-xs text-ink-600">{roomRulesReminder}</p>
    </div>
  );
}
