import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { Ban, CircleCheck, FlaskRound, Lock, Printer, TriangleAlert } from 'lucide-react';
import { mayChangePlan, mayRunFromPlan, type PlanDetail } from '@lotwise/shared';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Field } from '../../../components/ui/field';
import { Input } from '../../../components/ui/input';
import { Notice } from '../../../components/ui/notice';
import { errorMessage, isApiError, withQuery } from '../../../lib/api-client';
import { useCurrentUser } from '../../../lib/auth';
import { formatDate, formatPercent, formatRoundedAmount } from '../../../lib/format';
import { paths } from '../../../config/paths';
import { useCancelPlan, usePlan, useReservePlan } from '../api';
import { PlanStatusBadge } from '../labels';
import { BackLink, PageHeader, QueryState, Section } from '../components/page-parts';
import { PreparationSafety } from '../components/preparation-safety';
import { ProcedureSteps } from '../components/procedure-steps';
import { fullPrecision } from '../components/rounded';
import { StockAmount } from '../components/stock-amount';
import { StockCheckTable } from '../components/stock-check-table';
import { TableScroll } from '../../../components/ui/table-scroll';

function ReserveControls({ plan }: { plan: PlanDetail }) {
  const reserve = useReservePlan(plan.id);
  const cancel = useCancelPlan(plan.id);
  const [until, setUntil] = useState(plan.reservedUntil ?? plan.plannedOn);
  const [confirmCancel, setConfirmCancel] = useState(false);
  const open = plan.status === 'draft' || plan.status === 'reserved' || plan.status === 'lapsed';
  if (!open) return null;
  const error = reserve.error ?? cancel.error;
  return (
    <div className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-white px-4 py-3">
      <div className="flex flex-wrap items-end gap-3">
        <Field label="Hold the containers until" className="w-52">
          {(props) => (
            <Input
              {...props}
              type="date"
              value={until}
              onChange={(event) => setUntil(event.target.value)}
            />
          )}
        </Field>
        <Button
          variant="primary"
          busy={reserve.isPending}
          icon={<Lock aria-hidden="true" className="size-4" />}
          onClick={() => reserve.mutate({ until })}
        >
          {plan.status === 'reserved' ? 'Reserve again' : 'Reserve'}
        </Button>
        {confirmCancel ? (
          <span className="flex flex-wrap items-center gap-2 text-sm">
            Cancel this plan and release what it holds?
            <Button
              variant="danger"
              size="sm"
              busy={cancel.isPending}
              onClick={() => cancel.mutate(undefined, { onSettled: () => setConfirmCancel(false) })}
            >
              Yes, cancel the plan
            </Button>
            <Button size="sm" onClick={() => setConfirmCancel(false)}>
              Keep it
            </Button>
          </span>
        ) : (
          <Button
            icon={<Ban aria-hidden="true" className="size-4" />}
            onClick={() => setConfirmCancel(true)}
          >
            Cancel plan
          </Button>
        )}
      </div>
      <p className="text-xs text-ink-600">
        Reserving holds the containers listed under “Take from” so other plans do not count on them.
        It replaces anything this plan held before. A line that is short is held as far as stock
        goes.
      </p>
      {error && (
        <Notice
          tone="danger"
          title={
            isApiError(error) && error.status === 409
              ? 'Nothing was reserved: stock changed'
              : 'That did not work'
          }
        >
          {errorMessage(error)}
          {isApiError(error) &&
            Object.values(error.fields).map((text) => (
              <span key={text} className="block">
                {text}
              </span>
            ))}
        </Notice>
      )}
      {reserve.isSuccess && !error && (
        <Notice tone="ok">Reserved until {formatDate(plan.reservedUntil)}.</Notice>
      )}
    </div>
  );
}

function PlanView({ plan }: { plan: PlanDetail }) {
  const { data: me } = useCurrentUser();
  // The one ownership rule (shared/src/roles.ts): anyone who records runs may run from this
  // plan; only its author or a manager may change, reserve for or cancel it.
  const mayRecord = me ? mayRunFromPlan(me) : false;
  const mayChange = me ? mayChangePlan(me, { authorId: plan.createdBy?.id ?? null }) : false;
  const active = plan.reservations.filter((r) => r.status === 'active');
  const recordable = plan.status !== 'cancelled' && plan.status !== 'recorded';

  return (
    <div className="flex flex-col gap-5">
      <BackLink to={paths.plans}>All session plans</BackLink>
      <PageHeader
        eyebrow={<>Session plan #{plan.id}</>}
        title={
          <Link
            to={paths.procedure(plan.procedure.id)}
            className="underline-offset-2 hover:underline"
          >
            {plan.procedure.title}
          </Link>
        }
        actions={
          <>
            <Link to={paths.planDispensing(plan.id)} className={buttonClasses('secondary')}>
              <Printer aria-hidden="true" className="size-4" />
              Dispensing sheet
            </Link>
            {mayRecord && recordable && (
              <Link
                to={withQuery(paths.runNew, { planId: plan.id })}
                className={buttonClasses('secondary')}
              >
                <FlaskRound aria-hidden="true" className="size-4" />
                Record a run
              </Link>
            )}
            {plan.runId !== null && (
              <Link to={paths.run(plan.runId)} className={buttonClasses('secondary')}>
                Run #{plan.runId}
              </Link>
            )}
          </>
        }
      >
        <p className="flex flex-wrap items-center gap-2">
          <PlanStatusBadge status={plan.status} />
          <span className="tabular-nums">
            {plan.benches} {plan.benches === 1 ? 'bench' : 'benches'} × scale{' '}
            {fullPrecision(plan.scaleFactor)} + {formatPercent(plan.overagePercent)} overage ={' '}
            factor {fullPrecision(plan.totalFactor)} of the base scale ·{' '}
            {formatDate(plan.plannedOn)}
            {plan.reservedUntil && ` · held until ${formatDate(plan.reservedUntil)}`}
          </span>
        </p>
        {plan.notes && <p className="mt-1 text-ink-700">{plan.notes}</p>}
        {mayRecord && !mayChange && (
          <p className="mt-1 text-ink-700" data-testid="plan-ownership">
            Planned by {plan.createdBy?.displayName ?? 'someone else'}. You can record a run from
            this plan — the run is yours; only {plan.createdBy?.displayName ?? 'its author'} or a
            manager can change or cancel the plan.
          </p>
        )}
      </PageHeader>

      <PreparationSafety hazards={plan.hazards} cautions={plan.cautions} />

      <Section id="stock-check-heading" title="Stock check">
        {plan.stockCheck.ok ? (
          <Notice tone="ok" title="Everything needed is in stock">
            Every required line is covered by usable containers.
          </Notice>
        ) : (
          <Notice
            tone="warn"
            title={`${plan.stockCheck.shortCount} ${plan.stockCheck.shortCount === 1 ? 'line is' : 'lines are'} short`}
          >
            {plan.stockCheck.benchesServed > 0
              ? `What is on hand serves ${plan.stockCheck.benchesServed === 1 ? 'bench 1' : `benches 1–${plan.stockCheck.benchesServed}`} of ${plan.benches}. `
              : `What is on hand serves none of the ${plan.benches} benches. `}
            See what to do under each short line: reorder it, or prepare it first with another
            procedure.
          </Notice>
        )}
        <StockCheckTable check={plan.stockCheck} />
      </Section>

      <ProcedureSteps
        id="plan-steps-heading"
        steps={plan.steps}
        lines={plan.stockCheck.lines
          .filter((line) => line.purpose === 'line')
          .map((line) => ({
            lineIndex: line.lineIndex,
            name: line.chemical.name,
            amount: line.perBenchDisplay ? formatRoundedAmount(line.perBenchDisplay) : null,
          }))}
        note="Amounts for one bench, as the stock check counts them."
      />

      {mayChange && <ReserveControls plan={plan} />}

      <Section id="reservations-heading" title="Held for this plan">
        {active.length === 0 ? (
          <p className="text-sm text-ink-600">Nothing is held for this plan.</p>
        ) : (
          <TableScroll className="rounded-lg border border-ink-200 bg-white">
            <table aria-label="Held for this plan" className="w-full text-sm">
              <thead className="border-b border-ink-200 bg-ink-50 text-left text-xs text-ink-600 uppercase">
                <tr>
                  <th className="px-3 py-2 font-medium">Container</th>
                  <th className="px-3 py-2 font-medium">Chemical</th>
                  <th className="px-3 py-2 font-medium">Location</th>
                  <th className="px-3 py-2 text-right font-medium">Held</th>
                  <th className="px-3 py-2 font-medium">Until</th>
                </tr>
              </thead>
              <tbody>
                {active.map((r) => (
                  <tr key={r.id} className="border-b border-ink-100 last:border-b-0">
                    <td className="px-3 py-1.5">
                      <Link
                        to={paths.stockContainer(r.containerId)}
                        className="font-mono text-xs font-semibold text-accent-700 underline-offset-2 hover:underline"
                      >
                        {r.labelCode}
                      </Link>
                    </td>
                    <td className="px-3 py-1.5">{r.chemicalName}</td>
                    <td className="px-3 py-1.5 text-ink-700">{r.locationPath}</td>
                    <td className="px-3 py-1.5 text-right">
                      <StockAmount value={r.quantity} unit={r.unit} />
                      {r.reservedQuantity > r.quantity && (
                        <span className="block text-xs text-warn-700">
                          of <StockAmount value={r.reservedQuantity} unit={r.unit} /> reserved:
                          drawn since
                        </span>
                      )}
                    </td>
                    <td className="px-3 py-1.5 whitespace-nowrap">{formatDate(r.until)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableScroll>
        )}
        {plan.status === 'recorded' && (
          <p className="flex items-center gap-1.5 text-sm text-ok-700">
            <CircleCheck aria-hidden="true" className="size-4" /> The run was recorded; what was
            held has been released.
          </p>
        )}
        {plan.status === 'lapsed' && (
          <p className="flex items-center gap-1.5 text-sm text-warn-700">
            <TriangleAlert aria-hidden="true" className="size-4" /> The reservation ran out; reserve
            again to hold the containers.
          </p>
        )}
      </Section>
    </div>
  );
}

export function PlanPage() {
  const id = Number(useParams().id);
  const plan = usePlan(id);
  return (
    <QueryState query={plan} what="plan">
      {(data) => <PlanView plan={data} />}
    </QueryState>
  );
}
