import { Section } from '../../preparations/components/page-parts';
import { useRunTimeline } from '../api';
import { DeviationsList } from './deviations-list';

/**
 * The run's deviations, shown on the record form above its submit so the person recording
 * sees them (they stay in the run's timeline; recording does not change them).
 */
export function RecordDeviations({ runId }: { runId: number }) {
  const query = useRunTimeline(runId);
  let body;
  if (query.isPending) body = <p className="text-sm text-ink-600">Loading the timeline…</p>;
  else if (query.isError)
    body = (
      <p className="text-sm text-warn-700">
        The run’s timeline could not be loaded; its deviations are on the run page.
      </p>
    );
  else if (query.data.entries.length === 0)
    body = (
      <p className="text-sm text-ink-600">Nothing was recorded at the bench during this run.</p>
    );
  else body = <DeviationsList timeline={query.data} />;
  return (
    <Section id="record-deviations-heading" title="Deviations">
      {body}
    </Section>
  );
}
