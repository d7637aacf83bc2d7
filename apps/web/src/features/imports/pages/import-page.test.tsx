import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { Import, ImportSummary } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { mockXhrThroughFetch } from '../../../test/xhr-mock';

const manager = makeUser({ role: 'manager' });

const summary: ImportSummary = {
  rows: 3,
  blankRowsSkipped: 0,
  chemicals: { new: 1, existing: 1 },
  lots: { new: 2, existing: 0 },
  containers: { new: 3, generatedLabelCodes: 3 },
  locations: { new: 1, existing: 1 },
  newChemicalNames: ['Ethanol'],
  newLocationPaths: ['Room 101 › Cabinet C'],
};

function makeImport(overrides: Partial<Import> = {}): Import {
  return {
    id: 1,
    kind: 'stock',
    supplier: null,
    fileName: 'stock.csv',
    status: 'ready',
    totalRows: 3,
    processedRows: 3,
    errorCount: 0,
    errors: [],
    errorsPage: 1,
    errorsPageSize: 25,
    warnings: [],
    summary,
    priceList: null,
    failure: null,
    createdBy: { id: manager.id, displayName: manager.displayName },
    createdAt: '2026-11-30T10:00:00.000Z',
    updatedAt: '2026-11-30T10:00:00.000Z',
    committedAt: null,
    ...overrides,
  };
}

const invalid = makeImport({
  id: 1,
  status: 'invalid',
  errorCount: 2,
  errors: [
    {
      row: 3,
      column: 'CAS RN',
      field: 'casNumber',
      value: '64-17-6',
      message: 'CAS RN 64-17-6 fails its check digit (it should end in 5).',
    },
    {
      row: 4,
      column: 'Unit',
      field: 'unit',
      value: 'bottles',
      message: 'Unit "bottles" is not a mass or volume unit.',
    },
  ],
});

const csv = (name: string) =>
  new File(['Chemical,Quantity,Unit,Location\n'], name, { type: 'text/csv' });

describe('Stock import', () => {
  it('when the file has bad rows, then each problem is listed and import is refused until a fixed file passes', async () => {
    mockXhrThroughFetch();
    let uploads = 0;
    let committed = false;
    const { requests } = mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'POST /api/imports': () => {
        uploads += 1;
        return { status: 201, body: uploads === 1 ? invalid : makeImport({ id: 2 }) };
      },
      'GET /api/imports/1': { body: invalid },
      'GET /api/imports/2': () => ({
        body: makeImport({
          id: 2,
          status: committed ? 'committed' : 'ready',
          committedAt: committed ? '2026-11-30T10:01:00.000Z' : null,
        }),
      }),
      'POST /api/imports/2/commit': () => {
        committed = true;
        return { body: makeImport({ id: 2, status: 'committed' }) };
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/import');

    const input = await screen.findByLabelText(/Drop the CSV file here/, {}, { timeout: 5000 });
    await user.upload(input, csv('stock.csv'));

    const problems = await screen.findByRole(
      'table',
      { name: 'Problems in the file' },
      { timeout: 8000 },
    );
    const rows = within(problems).getAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(within(rows[1]!).getByText('3')).toBeInTheDocument();
    expect(within(rows[1]!).getByText('CAS RN')).toBeInTheDocument();
    expect(within(rows[1]!).getByText(/fails its check digit/)).toBeInTheDocument();
    expect(within(rows[2]!).getByText('Unit')).toBeInTheDocument();

    const importButton = screen.getByRole('button', { name: 'Import 3 rows' });
    expect(importButton).toBeDisabled();
    expect(importButton).toHaveAccessibleDescription(/the file has 2 problems/);
    expect(screen.getAllByText(/all or nothing/).length).toBeGreaterThan(0);
    expect(requests.some((r) => r.url.pathname.endsWith('/commit'))).toBe(false);

    await user.upload(screen.getByLabelText(/Upload the corrected file/), csv('stock-fixed.csv'));
    const enabled = await screen.findByRole('button', { name: 'Import 3 rows' });
    await waitFor(() => expect(enabled).toBeEnabled());
    expect(screen.queryByRole('table', { name: 'Problems in the file' })).not.toBeInTheDocument();
    expect(screen.getByText('3 to add')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Import 3 rows' }));
    expect(await screen.findByText('stock.csv is imported')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'See the containers' })).toBeInTheDocument();
    const uploadsSent = requests.filter(
      (r) => r.method === 'POST' && r.url.pathname === '/api/imports',
    );
    expect(uploadsSent.map((r) => (r.body as { file: string }).file)).toEqual([
      'stock.csv',
      'stock-fixed.csv',
    ]);
  });

  it('when a large file is still being checked, then the rows checked so far are shown', async () => {
    mockXhrThroughFetch();
    let polls = 0;
    mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'POST /api/imports': {
        status: 202,
        body: makeImport({
          status: 'validating',
          totalRows: 12000,
          processedRows: 0,
          summary: null,
        }),
      },
      'GET /api/imports/1': () => {
        polls += 1;
        return {
          body:
            polls < 2
              ? makeImport({
                  status: 'validating',
                  totalRows: 12000,
                  processedRows: 4500,
                  summary: null,
                })
              : makeImport({ totalRows: 12000, processedRows: 12000 }),
        };
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/import');
    await user.upload(
      await screen.findByLabelText(/Drop the CSV file here/, {}, { timeout: 5000 }),
      csv('big.csv'),
    );

    expect(await screen.findByText('4,500 of 12,000 rows checked')).toBeInTheDocument();
    expect(screen.getByRole('progressbar', { name: 'Checking stock.csv' })).toHaveAttribute(
      'aria-valuenow',
      '4500',
    );
    expect(
      await screen.findByRole('button', { name: 'Import 3 rows' }, { timeout: 3000 }),
    ).toBeEnabled();
  });

  it('when the server refuses the file type, then the person is told to save it as CSV', async () => {
    mockXhrThroughFetch();
    mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'POST /api/imports': {
        status: 415,
        body: {
          error: {
            code: 'unsupported_media_type',
            message: 'This is a workbook (e.g. .xlsx), not CSV.',
          },
        },
      },
    });
    const user = userEvent.setup();
    renderApp('/stock/import');
    await user.upload(
      await screen.findByLabelText(/Drop the CSV file here/, {}, { timeout: 5000 }),
      // Named .csv, but a workbook inside: the server reads the content.
      new File(['PK'], 'stock.csv'),
    );
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Only CSV text files can be imported');
    expect(alert).toHaveTextContent('This is a workbook');
  });
});
