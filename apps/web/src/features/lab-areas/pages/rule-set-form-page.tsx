import { useState } from 'react';
import { Link, useNavigate, useParams, useSearchParams } from 'react-router';
import { ChevronLeft } from 'lucide-react';
import { ruleSetKindLabels, ruleSetKinds, type RuleSetKind } from '@lotwise/shared';
import { useCreateRuleSet, useRuleSet, useUpdateRuleSet } from '../../../components/room-rules/api';
import { ErrorState } from '../../../components/ui/error-state';
import { Field } from '../../../components/ui/field';
import { Select } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { blankData, dataOf } from '../components/rule-set-data';
import { RuleSetForm } from '../components/rule-set-form';

const back = (
  <Link
    to={paths.stockRuleSets}
    className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
  >
    <ChevronLeft aria-hidden="true" className="size-4" />
    All rule sets
  </Link>
);

/** `/stock/rule-sets/new[?from=<id>]`: a new set, blank or copied from another. */
export function RuleSetNewPage() {
  const [search] = useSearchParams();
  const fromId = Number(search.get('from')) || 0;
  const from = useRuleSet(fromId);
  const create = useCreateRuleSet();
  const navigate = useNavigate();
  const [kind, setKind] = useState<RuleSetKind>('flammable-limits');

  if (fromId && from.isPending) return <PageSpinner label="Loading the set to copy…" />;
  if (fromId && from.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        <ErrorState
          title="The set to copy could not be loaded"
          error={from.error}
          onRetry={() => void from.refetch()}
        />
      </div>
    );
  }
  const source = fromId ? from.data : undefined;

  return (
    <div className="flex max-w-4xl flex-col gap-5">
      {back}
      <header>
        <h1 className="text-xl font-semibold text-ink-900">
          {source ? `Copy of ${source.name}` : 'New rule set'}
        </h1>
        <p className="text-sm text-ink-600">
          {source
            ? `Starts from the figures of ${source.citation}. Change them to what your authority set, and say where they come from.`
            : 'Enter the limits your regulator or authority set, and say where they come from.'}
        </p>
      </header>
      {!source && (
        <Field label="What the set limits" className="max-w-md">
          {(c) => (
            <Select {...c} value={kind} onChange={(e) => setKind(e.target.value as RuleSetKind)}>
              {ruleSetKinds.map((k) => (
                <option key={k} value={k}>
                  {ruleSetKindLabels[k]}
                </option>
              ))}
            </Select>
          )}
        </Field>
      )}
      <RuleSetForm
        key={source ? `from-${source.id}` : kind}
        initial={{
          name: source ? `${source.name} (our copy)` : '',
          source: source?.source ?? '',
          edition: source?.edition ?? '',
          reference: source?.reference ?? '',
          notes: source?.notes ?? '',
        }}
        initialData={source ? dataOf(source) : blankData(kind)}
        submitLabel="Save rule set"
        onSubmit={async (body) => {
          const saved = await create.mutateAsync(body);
          navigate(paths.stockRuleSet(saved.id), { replace: true });
        }}
        onCancel={() => navigate(-1)}
      />
    </div>
  );
}

/** `/stock/rule-sets/:id/edit`: a lab's own set (built-in sets are copied instead). */
export function RuleSetEditPage() {
  const params = useParams();
  const id = Number(params.id);
  const query = useRuleSet(id);
  const update = useUpdateRuleSet(id);
  const navigate = useNavigate();

  if (query.isPending) return <PageSpinner label="Loading the rule set…" />;
  if (query.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        <ErrorState
          title="The rule set could not be loaded"
          error={query.error}
          onRetry={() => void query.refetch()}
        />
      </div>
    );
  }
  const set = query.data;
  if (set.builtIn) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        <Notice tone="warn" title="Built-in sets cannot be changed">
          <Link to={`${paths.stockRuleSetNew}?from=${set.id}`} className="underline">
            Copy {set.name} to your own set
          </Link>{' '}
          and change the copy.
        </Notice>
      </div>
    );
  }

  return (
    <div className="flex max-w-4xl flex-col gap-5">
      {back}
      <h1 className="text-xl font-semibold text-ink-900">Change {set.name}</h1>
      <RuleSetForm
        initial={{
          name: set.name,
          source: set.source,
          edition: set.edition,
          reference: set.reference,
          notes: set.notes,
        }}
        initialData={dataOf(set)}
        submitLabel="Save changes"
        onSubmit={async (body) => {
          await update.mutateAsync(body);
          navigate(paths.stockRuleSet(set.id), { replace: true });
        }}
        onCancel={() => navigate(paths.stockRuleSet(set.id))}
      />
    </div>
  );
}
