import { Link } from 'react-router';
import { ClipboardPen } from 'lucide-react';
import type { RunTimeline } from '@lotwise/shared';
import { ErrorState } from '../../../components/ui/error-state';
import { Spinner } from '../../../components/ui/spinner';
import { paths } from '../../../config/paths';
import { Section } from '../../preparations/components/page-parts';
import { useRunTimeline } from '../api';
import { DeviationsList } from './deviations-list';
import { RunTimelineView, StepsTable } from './run-timeline';
import { TemperatureChart } from './temperature-chart';

/**
 * The three sections of a run's record: the temperature chart and the deviations first (what
 * a reader checks), then the whole timeline.
 */
export function TimelineSections({ timeline }: { timeline: RunTimeline }) {
  return (
    <>
      <Section id="temperature-heading" title="Temperature during the run">
        <TemperatureChart timeline={timeline} />
      </Section>
      <Section id="deviations-heading" title="Deviations">
        <DeviationsList timeline={timeline} />
      </Section>
      <Section id="timeline-heading" title="Timeline">
        <RunTimelineView timeline={timeline} />
      </Section>
    </>
  );
}

function EmptyTimeline({ timeline, benchLink }: { timeline: RunTimeline; benchLink: boolean }) {
  const open = timeline.status === 'open';
  return (
    <Section id="timeline-heading" title="Timeline">
      <div className="flex flex-col items-start gap-2 rounded-lg border border-dashed border-ink-300 bg-white px-4 py-3 text-sm">
        <p className="font-medium text-ink-900">
          {open ? 'Nothing recorded during this run yet' : 'Nothing was recorded during this run'}
        </p>
        {open && (
          <p className="text-ink-700">
            Steps, timers, temperature readings, notes and photos taken at the bench appear here as
            they are entered.
          </p>
        )}
        {open && benchLink && (
          <Link
            to={paths.runBench(timeline.runId)}
            className="inline-flex items-center gap-1.5 text-accent-700 underline underline-offset-2"
          >
            <ClipboardPen aria-hidden="true" className="size-4" />
            Open the bench page
          </Link>
        )}
      </div>
      {timeline.steps.length > 0 && <StepsTable steps={timeline.steps} withDate={false} />}
    </Section>
  );
}

/**
 * The timeline, the chart and the deviations of one run, fetched on their own (an open run's
 * timeline is fetched again every few seconds so a second screen follows the bench).
 */
export function RunTimelineSections({
  runId,
  open,
  benchLink = false,
}: {
  runId: number;
  open: boolean;
  /** Offer the bench page when nothing is recorded yet. */
  benchLink?: boolean;
}) {
  const query = useRunTimeline(runId, { follow: open });
  if (query.isPending) {
    return (
      <p className="flex items-center gap-2 text-sm text-ink-600">
        <Spinner size="sm" /> Loading the timeline…
      </p>
    );
  }
  if (query.isError) {
    return (
      <ErrorState
        title="The run’s timeline could not be loaded"
        error={query.error}
        onRetry={() => void query.refetch()}
      />
    );
  }
  if (query.data.entries.length === 0) {
    return <EmptyTimeline timeline={query.data} benchLink={benchLink} />;
  }
  return <TimelineSections timeline={query.data} />;
}
