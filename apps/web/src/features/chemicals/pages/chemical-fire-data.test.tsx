import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeChemical, makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';

const ethanol = makeChemical({
  name: 'Ethanol',
  formula: 'C2H6O',
  physicalState: 'liquid',
  ghsPictograms: ['GHS02'],
  hazardStatements: ['H225'],
  storageGroup: 'flammable',
  flashPointC: 12.8,
  boilingPointC: 78.3,
  flashPointSource: 'NIOSH Pocket Guide to Chemical Hazards',
  boilingPointSource: 'Merck Index',
  liquidClass: 'IB',
  ghsFlammableCategory: 2,
});

describe('Fire data of a chemical', () => {
  it('shows the figures with their sources, the NFPA 30 class with its meaning and the GHS category with its H-statement', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      [`GET /api/chemicals/${ethanol.id}`]: { body: ethanol },
    });
    renderApp(`/chemicals/${ethanol.id}`);

    const fire = await screen.findByRole('region', { name: 'Fire data' });
    expect(within(fire).getByText('12.8 °C')).toBeInTheDocument();
    expect(
      within(fire).getByText('Source: NIOSH Pocket Guide to Chemical Hazards'),
    ).toBeInTheDocument();
    expect(fire).toHaveTextContent(
      'Class IB flammable liquid: flash point below 22.8 °C, boiling point 37.8 °C or above — NFPA 30 (2024) §4.3',
    );
    expect(fire).toHaveTextContent('Category 2, H225 Highly flammable liquid and vapour');
    expect(fire).toHaveTextContent('GHS Rev. 10 Table 2.6.1');
    expect(within(fire).queryByText(/disagree/)).not.toBeInTheDocument();
    expect(fire).toHaveTextContent(/reminder.*SDS/);
  });

  it('when the H-statements disagree with the category the figures give, then it asks to check the figures against the SDS', async () => {
    const odd = {
      ...ethanol,
      id: ethanol.id + 1,
      flashPointC: 30,
      liquidClass: 'IC',
      ghsFlammableCategory: 3,
    };
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'viewer' }) } },
      [`GET /api/chemicals/${odd.id}`]: { body: odd },
    });
    renderApp(`/chemicals/${odd.id}`);

    const fire = await screen.findByRole('region', { name: 'Fire data' });
    expect(fire).toHaveTextContent(
      'The hazard statements list H225, but the figures give category 3 (H226): check the figures against the SDS.',
    );
  });

  it('when a manager types a flash point with a decimal comma and a minus sign, then the form sends the numbers', async () => {
    let sent: Record<string, unknown> = {};
    mockFetch({
      'GET /api/auth/me': { body: { user: makeUser({ role: 'manager' }) } },
      [`GET /api/chemicals/${ethanol.id}`]: { body: ethanol },
      [`PATCH /api/chemicals/${ethanol.id}`]: (request) => {
        sent = request.body as Record<string, unknown>;
        return { body: { ...ethanol, ...sent } };
      },
    });
    const user = userEvent.setup();
    renderApp(`/chemicals/${ethanol.id}/edit`);

    const flash = await screen.findByLabelText(/Flash point \(°C\)/);
    await user.clear(flash);
    await user.type(flash, '−17,8');
    await user.tab();
    expect(await screen.findByText(/GHS category 2 \(H225\)/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: /Save/ }));
    await waitFor(() => expect(sent).toEqual({ flashPointC: -17.8 }));
  });
});
