import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { formatDate } from '../../../lib/format';
import { mockFetch } from '../../../test/fetch-mock';
import { makeContainer, makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { labelHazardStatements } from '../components/label-sheet';

const ethanol = makeContainer({
  id: 1,
  labelCode: 'LW-00001',
  chemical: {
    id: 4,
    name: 'Ethanol',
    formula: 'C2H6O',
    casNumber: '64-17-5',
    density: 0.789,
    storageGroup: 'flammable',
    extraHazardGroups: [],
    ghsPictograms: ['GHS02', 'GHS07'],
    hazardStatements: ['H225', 'H319'],
    peroxideClass: null,
    stockUnit: 'mL',
  },
});
const salt = makeContainer({ id: 2, labelCode: 'LW-00002' });

describe('Label sheet', () => {
  it('when containers are asked for, then each gets one label with its code as text and as a QR code', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/settings/public': { body: { publicUrl: 'https://lab.example.test' } },
      'GET /api/containers/1': { body: ethanol },
      'GET /api/containers/2': { body: salt },
    });
    renderApp('/stock/labels?ids=1,2');

    const labels = await screen.findAllByTestId('container-label', {}, { timeout: 5000 });
    expect(labels).toHaveLength(2);
    expect(screen.getAllByRole('img', { name: /^QR code for / })).toHaveLength(2);

    const first = within(labels[0]!);
    expect(first.getByText('LW-00001')).toBeInTheDocument();
    expect(first.getByText('Ethanol')).toBeInTheDocument();
    expect(first.getByText('GHS02')).toBeInTheDocument();
    expect(first.getByText('GHS07')).toBeInTheDocument();
    expect(first.getByText(/Store: Flammable/)).toBeInTheDocument();
    // The reader's date format, as on every other page.
    expect(first.getByText(formatDate('2028-06-30'))).toBeInTheDocument();
    // Codes with their text where they fit beside the pictograms.
    expect(first.getByLabelText('Hazard statements')).toHaveTextContent(
      'H225 Highly flammable liquid and vapour; H319 Causes serious eye irritation',
    );
    // The QR holds the container's address at the lab's public address (not this browser's),
    // which a phone's camera app, the scan button and the search box all open.
    const qr = first.getByRole('img', { name: 'QR code for LW-00001' });
    expect(qr.getAttribute('data-qr-value')).toBe('https://lab.example.test/stock/c/LW-00001');
    expect(qr.querySelector('path')?.getAttribute('d')).toMatch(/^M\d/);

    expect(within(labels[1]!).getByText('LW-00002')).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Print' })).toBeEnabled();
    expect(screen.getByText('2 labels on 1 sheet')).toBeInTheDocument();
  });

  it('when H-statements are too long to print with their text, then the label prints their codes', () => {
    expect(labelHazardStatements(['H225', 'H319'])).toBe(
      'H225 Highly flammable liquid and vapour; H319 Causes serious eye irritation',
    );
    expect(labelHazardStatements(['H225', 'H301', 'H311', 'H331', 'H370'])).toBe(
      'H225 H301 H311 H331 H370',
    );
    expect(labelHazardStatements([])).toBe('');
  });

  it('when a label code is unknown, then the sheet says so and prints the others', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      'GET /api/settings/public': { body: { publicUrl: 'https://lab.example.test' } },
      'GET /api/containers/by-label/LW-00002': { body: salt },
    });
    renderApp('/stock/labels?labelCodes=lw-2,LW-00999');

    expect(
      await screen.findByRole('img', { name: 'QR code for LW-00002' }, { timeout: 5000 }),
    ).toBeInTheDocument();
    expect(await screen.findByText(/1 of the labels asked for cannot be made/)).toBeInTheDocument();
    expect(screen.getByText(/LW-00999:/)).toBeInTheDocument();
  });
});
