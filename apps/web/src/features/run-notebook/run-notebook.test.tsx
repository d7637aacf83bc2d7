import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../test/fetch-mock';
import { makeUser } from '../../test/factories';
import { renderApp } from '../../test/render-app';
import { makeAspirinProcedure, makeRun } from '../preparations/test-factories';
import { makeTimeline } from './test-factories';

const procedure = makeAspirinProcedure();

function routes(role: 'member' | 'viewer', timeline = makeTimeline()) {
  return {
    'GET /api/auth/me': { body: { user: makeUser({ role }) } },
    'GET /api/procedures/1': { body: procedure },
    'GET /api/runs/10': { body: makeRun({ id: 10 }) },
    'GET /api/runs/10/timeline': { body: timeline },
  };
}

describe('The run page’s timeline', () => {
  it('when a reading fell outside its step’s window, then the timeline, the chart and the deviations say so in words', async () => {
    mockFetch(routes('member'));
    renderApp('/preparations/runs/10');

    const timeline = await screen.findByRole('region', { name: 'Timeline' }, { timeout: 5000 });
    const steps = within(timeline).getByRole('table', { name: 'Steps: planned and actual times' });
    const addition = within(steps)
      .getByRole('rowheader', { name: /Step 2/ })
      .closest('tr')!;
    expect(addition).toHaveTextContent('5–7 °C');
    expect(addition).toHaveTextContent('20 min'); // planned 20 min, took 09:10–09:30
    expect(addition).toHaveTextContent('Add 12.5 mL Sodium nitrite solution dropwise');
    expect(addition).toHaveTextContent('Exothermic addition: add slowly with cooling');
    expect(within(steps).getAllByRole('row').at(-1)).toHaveTextContent('under way');

    const entries = within(timeline).getAllByTestId('timeline-entry');
    expect(entries).toHaveLength(11);
    const outside = entries.find((entry) => entry.textContent?.includes('9 °C'))!;
    expect(outside).toHaveTextContent('Deviation: Reading outside the window');
    expect(outside).toHaveTextContent('Window: 5–7 °C');
    expect(outside).toHaveTextContent('What to do: Slow the addition and add ice to the bath.');
    const photo = within(timeline).getByRole('img', { name: 'Pale yellow solution' });
    expect(photo.closest('a')).toHaveAttribute('href', '/api/runs/10/photos/40');

    const chart = screen.getByRole('region', { name: 'Temperature during the run' });
    expect(within(chart).getAllByTestId('window-band')).toHaveLength(2);
    expect(within(chart).getAllByTestId('reading-outside')).toHaveLength(1);
    expect(within(chart).getAllByTestId('reading-inside')).toHaveLength(2);
    expect(within(chart).getByRole('img', { name: /1 reading outside its window/ })).toBeVisible();
    expect(within(chart).getByText('Temperature (°C)')).toBeInTheDocument();

    const deviations = screen.getByRole('region', { name: 'Deviations' });
    expect(within(deviations).getByTestId('deviation-count')).toHaveTextContent('1 deviation');
    const item = within(deviations).getByRole('listitem');
    expect(item).toHaveTextContent('Reading outside the window');
    expect(item).toHaveTextContent(
      'Step 2: Add the nitrite solution dropwise, keeping the mixture between 5 and 7 °C',
    );
    expect(item).toHaveTextContent('9 °C is 2 °C above the window of step 2 (5–7 °C)');
    expect(item).toHaveTextContent('What to do: Slow the addition');
  });

  it('when nothing was entered during an open run, then the page says so and links the bench page (its big bench button)', async () => {
    const empty = makeTimeline({ entries: [], deviations: [], currentStepIndex: null });
    empty.steps = empty.steps.map((step) => ({ ...step, startedAt: null, endedAt: null }));
    mockFetch(routes('member', empty));
    renderApp('/preparations/runs/10');

    expect(
      await screen.findByText('Nothing recorded during this run yet', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Follow the steps at the bench' })).toHaveAttribute(
      'href',
      '/preparations/runs/10/bench',
    );
    expect(screen.queryByRole('region', { name: 'Deviations' })).not.toBeInTheDocument();
  });

  it('when a viewer opens an open run with nothing entered, then the bench page is offered to follow along, and the notebook page', async () => {
    const empty = makeTimeline({ entries: [], deviations: [] });
    mockFetch(routes('viewer', empty));
    renderApp('/preparations/runs/10');

    expect(
      await screen.findByText('Nothing recorded during this run yet', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Follow the steps at the bench' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Notebook page' })).toHaveAttribute(
      'href',
      '/preparations/runs/10/notebook',
    );
  });
});

describe('Recording a run with deviations', () => {
  it('when the run deviated, then the record form lists the deviations above its submit', async () => {
    mockFetch(routes('member'));
    renderApp('/preparations/runs/10/record');

    const deviations = await screen.findByRole('region', { name: 'Deviations' }, { timeout: 5000 });
    expect(await within(deviations).findByTestId('deviation-count')).toHaveTextContent(
      '1 deviation',
    );
    expect(deviations).toHaveTextContent('Reading outside the window');
    const submit = screen.getByRole('button', { name: 'Record the run' });
    expect(deviations.compareDocumentPosition(submit) & Node.DOCUMENT_POSITION_FOLLOWING).toBe(
      Node.DOCUMENT_POSITION_FOLLOWING,
    );
  });
});

describe('The run’s notebook page', () => {
  it('when opened, then it holds the hazards with the deferral line, the chart, the deviations and a signature line', async () => {
    mockFetch(routes('viewer'));
    renderApp('/preparations/runs/10/notebook');

    expect(
      await screen.findByRole('heading', { level: 1, name: procedure.title }, { timeout: 5000 }),
    ).toBeInTheDocument();
    const safety = screen.getByRole('region', {
      name: 'Hazards of every chemical drawn or made, and the cautions',
    });
    expect(safety).toHaveTextContent('Acetic anhydride');
    expect(safety).toHaveTextContent('H314');
    expect(safety).toHaveTextContent(
      'SDS, local regulations and licensed practice take precedence',
    );
    expect(safety).toHaveTextContent('not a safety approval');
    expect(screen.getByRole('region', { name: 'Timeline' })).toBeInTheDocument();
    expect(screen.getByTestId('temperature-chart')).toBeInTheDocument();
    expect(screen.getByTestId('deviation-count')).toHaveTextContent('1 deviation');
    expect(screen.getByRole('region', { name: 'Signatures' })).toHaveTextContent('Checked by');
    expect(screen.getByRole('button', { name: 'Print' })).toBeInTheDocument();
  });
});
