import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { paths } from '../../../config/paths';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const document = {
  openapi: '3.1.0',
  info: { title: 'Lotwise API', version: '0.1.0' },
  paths: {
    '/api/health': { get: { summary: 'Health', tags: ['health'], 'x-lotwise-access': 'public' } },
    '/api/containers/{id}/draws': {
      post: {
        summary: 'Record a draw from a container',
        tags: ['containers'],
        'x-lotwise-access': 'stock.draw',
      },
    },
    '/api/containers/{id}': {
      get: { summary: 'Read a container', tags: ['containers'], 'x-lotwise-access': 'stock.read' },
      patch: {
        summary: 'Change a container',
        tags: ['containers'],
        'x-lotwise-access': 'stock.write',
      },
    },
  },
};

function setup(
  role: 'member' | 'viewer' = 'member',
  answer: { status?: number; body: unknown } = { body: document },
) {
  return mockFetch({
    'GET /api/auth/me': { body: { user: makeUser({ role }) } },
    'GET /api/openapi.json': answer,
  });
}

describe('Help page', () => {
  it('when opened, then it says what Lotwise is, puts safety first, links the jobs and lists the shortcuts', async () => {
    setup('member');
    renderApp(paths.help);
    await screen.findByRole('heading', { name: 'Help', level: 1 });
    expect(
      screen.getByText(/The SDS, local regulations and licensed practice take precedence/),
    ).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Record a run' })).toHaveAttribute(
      'href',
      paths.runNew,
    );
    expect(screen.getByRole('link', { name: 'Record a draw at the shelf' })).toBeInTheDocument();
    const shortcuts = screen.getByRole('region', { name: 'Keyboard shortcuts' });
    expect(within(shortcuts).getByText('Record a draw')).toBeInTheDocument();
    expect(within(shortcuts).getByLabelText('question mark')).toBeInTheDocument();
  });

  it('when the role cannot do a job, then the job is described without a link', async () => {
    setup('viewer');
    renderApp(paths.help);
    await screen.findByRole('heading', { name: 'Help', level: 1 });
    expect(screen.queryByRole('link', { name: 'Record a run' })).not.toBeInTheDocument();
    expect(screen.getByText('Record a run')).toBeInTheDocument();
  });

  it('when the API document loads, then its operations are listed by tag with method, path, access and summary, and the filter narrows them', async () => {
    setup();
    const user = userEvent.setup();
    renderApp(paths.help);
    const containers = await screen.findByRole('region', { name: 'Operations: containers' });
    const draw = within(containers).getByText('/api/containers/{id}/draws').closest('li')!;
    expect(draw).toHaveTextContent('post');
    expect(draw).toHaveTextContent('Record a draw from a container');
    expect(draw).toHaveTextContent('stock.draw');
    expect(screen.getByRole('region', { name: 'Operations: health' })).toHaveTextContent('public');
    expect(screen.getByRole('link', { name: /\/api\/openapi\.json/ })).toHaveAttribute(
      'href',
      '/api/openapi.json',
    );
    expect(screen.getByText('4 operations')).toBeInTheDocument();

    await user.type(
      screen.getByRole('searchbox', { name: 'Filter operations' }),
      'patch container',
    );

    expect(await screen.findByText('1 of 4 operations')).toBeInTheDocument();
    expect(screen.queryByRole('region', { name: 'Operations: health' })).not.toBeInTheDocument();
    expect(screen.getByText('Change a container')).toBeInTheDocument();
    expect(screen.queryByText('Read a container')).not.toBeInTheDocument();
  });

  it('when the API document cannot be loaded, then the page says so and offers to try again', async () => {
    setup('member', { status: 500, body: { error: { code: 'internal', message: 'Broken.' } } });
    renderApp(paths.help);
    expect(await screen.findByText('The API document could not be loaded')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeInTheDocument();
  });
});
