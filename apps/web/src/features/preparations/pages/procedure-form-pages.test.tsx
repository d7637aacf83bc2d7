import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { mockFetch } from '../../../test/fetch-mock';
import { makeChemical, makeUser, page } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { aceticAnhydride, acetylsalicylicAcid, salicylicAcid } from '../test-factories';

const manager = makeUser({ role: 'manager' });
const chemicals = [salicylicAcid, aceticAnhydride, acetylsalicylicAcid].map((c) =>
  makeChemical({ ...c, physicalState: c.density === null ? 'solid' : 'liquid' }),
);

async function chooseChemical(line: HTMLElement, typed: string, name: RegExp) {
  const user = userEvent.setup();
  await user.type(within(line).getByRole('combobox', { name: 'Chemical' }), typed);
  await user.click(await screen.findByRole('option', { name }));
}

describe('Procedure form', () => {
  it('when 2.0 g salicylic acid and 5.0 mL acetic anhydride (1.082 g/mL) are typed, then the live calculation marks salicylic acid as limiting and shows a theoretical yield of 2.609 g', async () => {
    mockFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/chemicals': (request) => {
        const q = (request.url.searchParams.get('q') ?? '').toLowerCase();
        return { body: page(chemicals.filter((c) => c.name.toLowerCase().startsWith(q))) };
      },
    });
    const user = userEvent.setup();
    renderApp('/preparations/procedures/new');

    await user.type(await screen.findByLabelText('Title', {}, { timeout: 5000 }), 'Aspirin');
    const first = screen.getByRole('listitem', { name: 'Line 1' });
    await chooseChemical(first, 'salicylic', /^Salicylic acid/);
    await user.type(within(first).getByLabelText('Amount'), '2.0');

    const second = screen.getByRole('listitem', { name: 'Line 2' });
    await chooseChemical(second, 'acetic an', /^Acetic anhydride/);
    await user.type(within(second).getByLabelText('Amount'), '5.0');
    await user.selectOptions(within(second).getByLabelText('Unit'), 'mL');

    const third = screen.getByRole('listitem', { name: 'Line 3' });
    await chooseChemical(third, 'acetylsal', /^Acetylsalicylic acid/);

    const preview = screen.getByRole('table', { name: 'Live calculation' });
    const limitingRow = within(preview).getByTestId('stoich-line-0');
    expect(limitingRow).toHaveTextContent('Salicylic acid');
    expect(within(limitingRow).getByText('Limiting')).toBeInTheDocument();
    expect(within(preview).getByTestId('stoich-line-1')).not.toHaveTextContent('Limiting');
    // 5.0 mL × 1.082 g/mL / 102.089 g/mol = 52.99 mmol: 3.66 equivalents.
    expect(within(preview).getByTestId('stoich-line-1')).toHaveTextContent('3.66');

    // worked example, calc from CIAAW 2021: 2.0 / 138.122 × 180.159 = 2.609 g
    const theoretical = screen.getByTestId('theoretical-yield-mass');
    expect(Number(theoretical.dataset.value)).toBeCloseTo(2.609, 3);
    expect(theoretical).toHaveTextContent('2.61 g');
    expect(screen.getByTestId('theoretical-yield')).toHaveTextContent('14.5 mmol');
  });
});
