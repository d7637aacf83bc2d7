import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { makeTimeline, makeTimelineStep } from '../test-factories';
import { DeviationsList } from './deviations-list';

describe('DeviationsList', () => {
  it('when a step was ended early and a hold point passed, then each names its step, what happened and the time or hold point it is measured against', () => {
    const timeline = makeTimeline({
      deviations: [
        {
          entryId: 3,
          at: '2026-12-03T09:08:00.000Z',
          deviation: {
            reason: 'step-ended-early',
            stepIndex: 0,
            message: 'step 1 was ended after 8 min of its 10 min',
            instruction: '',
          },
        },
        {
          entryId: 4,
          at: '2026-12-03T09:40:00.000Z',
          deviation: {
            reason: 'hold-point-skipped',
            stepIndex: 2,
            message:
              'step 4 was started before the hold point of step 3 was confirmed ("the solution is clear")',
            instruction: '',
          },
        },
      ],
    });
    timeline.steps.push(makeTimelineStep({ index: 3, text: 'Filter the solid' }));
    render(<DeviationsList timeline={timeline} />);

    expect(screen.getByTestId('deviation-count')).toHaveTextContent('2 deviations');
    const [early, hold] = within(screen.getByRole('list', { name: 'Deviations' })).getAllByRole(
      'listitem',
    );
    expect(early).toHaveTextContent('Step ended before its time');
    expect(early).toHaveTextContent('Step 1: Cool the amine solution in an ice bath');
    expect(early).toHaveTextContent('Planned: 10 min');
    expect(early).not.toHaveTextContent('What to do');
    expect(hold).toHaveTextContent('Hold point passed without confirmation');
    expect(hold).toHaveTextContent('Step 3: Stir in the ice bath');
    expect(hold).toHaveTextContent('Hold point: do not go on until the solution is clear');
  });

  it('when nothing deviated, then it says so in words', () => {
    render(<DeviationsList timeline={makeTimeline({ deviations: [] })} />);
    expect(screen.getByText(/No deviations recorded/)).toBeInTheDocument();
    expect(screen.queryByTestId('deviation-count')).toBeNull();
  });
});
