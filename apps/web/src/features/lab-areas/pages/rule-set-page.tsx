import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import { ChevronLeft, Copy, Lock, Pencil, Trash2 } from 'lucide-react';
import { roomRulesReminder, ruleSetKindLabels } from '@lotwise/shared';
import { useDeleteRuleSet, useRuleSet } from '../../../components/room-rules/api';
import { Badge } from '../../../components/ui/badge';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { ErrorState } from '../../../components/ui/error-state';
import { Notice } from '../../../components/ui/notice';
import { PageSpinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { errorMessage, isApiError } from '../../../lib/api-client';
import { useCan } from '../../../lib/auth';
import { RuleSetFigures } from '../components/rule-set-figures';

const back = (
  <Link
    to={paths.stockRuleSets}
    className="inline-flex items-center gap-1 text-sm text-ink-600 hover:text-ink-900"
  >
    <ChevronLeft aria-hidden="true" className="size-4" />
    All rule sets
  </Link>
);

function DeleteDialog({
  id,
  name,
  onClose,
  onDeleted,
}: {
  id: number;
  name: string;
  onClose: () => void;
  onDeleted: () => void;
}) {
  const remove = useDeleteRuleSet(id);
  return (
    <Dialog
      open
      onClose={onClose}
      size="sm"
      title={`Delete ${name}?`}
      description="A set a lab area still uses cannot be deleted; choose another set for the area first."
      footer={
        <>
          <Button onClick={onClose} disabled={remove.isPending}>
            Keep it
          </Button>
          <Button
            variant="danger"
            busy={remove.isPending}
            onClick={() => remove.mutate(undefined, { onSuccess: onDeleted })}
          >
            Delete
          </Button>
        </>
      }
    >
      {remove.isError && (
        <Notice tone="danger" title="Not deleted">
          {errorMessage(remove.error)}
        </Notice>
      )}
    </Dialog>
  );
}

export function RuleSetPage() {
  const params = useParams();
  const id = Number(params.id);
  const query = useRuleSet(id);
  const mayWrite = useCan('stock.write');
  const navigate = useNavigate();
  const [deleting, setDeleting] = useState(false);

  if (query.isPending) return <PageSpinner label="Loading the rule set…" />;
  if (query.isError) {
    return (
      <div className="flex flex-col gap-4">
        {back}
        {isApiError(query.error) && query.error.status === 404 ? (
          <Notice tone="warn" title="No such rule set">
            There is no rule set with the number {params.id} — it may have been deleted.
          </Notice>
        ) : (
          <ErrorState
            title="The rule set could not be loaded"
            error={query.error}
            onRetry={() => void query.refetch()}
          />
        )}
      </div>
    );
  }
  const set = query.data;

  return (
    <div className="flex flex-col gap-5">
      {back}
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-sm text-ink-600">{ruleSetKindLabels[set.kind]}</p>
          <h1 className="flex flex-wrap items-center gap-2 text-xl font-semibold text-ink-900">
            {set.name}
            {set.builtIn ? (
              <Badge icon={<Lock aria-hidden="true" />}>Built in</Badge>
            ) : (
              <Badge tone="accent">Your own</Badge>
            )}
          </h1>
          <p className="text-sm text-ink-800">Source: {set.citation}</p>
        </div>
        {mayWrite && (
          <div className="flex flex-wrap gap-2">
            <Link
              to={`${paths.stockRuleSetNew}?from=${set.id}`}
              className={buttonClasses('secondary')}
            >
              <Copy aria-hidden="true" className="size-4" />
              Copy to my own set
            </Link>
            {!set.builtIn && (
              <>
                <Link to={paths.stockRuleSetEdit(set.id)} className={buttonClasses('secondary')}>
                  <Pencil aria-hidden="true" className="size-4" />
                  Change
                </Link>
                <Button
                  onClick={() => setDeleting(true)}
                  icon={<Trash2 aria-hidden="true" className="size-4" />}
                >
                  Delete
                </Button>
              </>
            )}
          </div>
        )}
      </header>
      {set.notes && <p className="text-sm whitespace-pre-line text-ink-700">{set.notes}</p>}
      <RuleSetFigures set={set} />
      <Notice tone="info" title="A reminder, not an approval">
        {roomRulesReminder}
      </Notice>
      {deleting && (
        <DeleteDialog
          id={set.id}
          name={set.name}
          onClose={() => setDeleting(false)}
          onDeleted={() => navigate(paths.stockRuleSets, { replace: true })}
        />
      )}
    </div>
  );
}
