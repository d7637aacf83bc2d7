import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { Procedure, ProcedurePatch } from '@lotwise/shared';
import { mockFetch } from '../../../test/fetch-mock';
import { makeUser } from '../../../test/factories';
import { renderApp } from '../../../test/render-app';
import { makeAspirinProcedure } from '../test-factories';

const manager = makeUser({ role: 'manager' });

const withSteps = (): Procedure =>
  makeAspirinProcedure({
    steps: [
      {
        index: 0,
        text: 'Add the anhydride to the acid.',
        durationMinutes: null,
        temperatureLowC: null,
        temperatureHighC: null,
        outsideWindow: '',
        lineIndex: 1,
        addition: 'in one portion',
        caution: 'fumeHood',
        holdPoint: '',
      },
      {
        index: 1,
        text: 'Warm on the water bath.',
        durationMinutes: 15,
        temperatureLowC: 50,
        temperatureHighC: 60,
        outsideWindow: 'take it off the bath',
        lineIndex: null,
        addition: '',
        caution: null,
        holdPoint: 'the solid has dissolved',
      },
    ],
  });

/** The edit page of the aspirin procedure; PATCH answers with `patchReply` when given. */
async function openEditor(patchReply?: { status: number; body: unknown }) {
  const procedure = withSteps();
  const { requests } = mockFetch({
    'GET /api/auth/me': { body: { user: manager } },
    'GET /api/procedures/1': { body: procedure },
    'PATCH /api/procedures/1': patchReply ?? { body: procedure },
  });
  renderApp('/preparations/procedures/1/edit');
  await screen.findByRole('listitem', { name: 'Step 1' }, { timeout: 5000 });
  const patched = async () => {
    await waitFor(() => expect(requests.some((r) => r.method === 'PATCH')).toBe(true));
    return requests.find((r) => r.method === 'PATCH')!.body as ProcedurePatch;
  };
  return { patched };
}

const save = () => userEvent.click(screen.getByRole('button', { name: 'Save changes' }));
const stepText = (name: string) =>
  (
    within(screen.getByRole('listitem', { name })).getByLabelText(
      'What to do',
    ) as HTMLTextAreaElement
  ).value;

describe('Procedure form: steps', () => {
  it('when a step is added, moved up and another removed, then the saved steps follow that order', async () => {
    const user = userEvent.setup();
    const { patched } = await openEditor();
    await user.click(screen.getByRole('button', { name: 'Add a step' }));
    const third = screen.getByRole('listitem', { name: 'Step 3' });
    await user.type(within(third).getByLabelText('What to do'), 'Pour onto ice.');
    await user.type(within(third).getByLabelText(/Time \(min\)/), '2,5');
    await user.click(screen.getByRole('button', { name: 'Move Step 3 up' }));
    expect(stepText('Step 2')).toBe('Pour onto ice.');
    expect(stepText('Step 3')).toBe('Warm on the water bath.');
    await user.click(screen.getByRole('button', { name: 'Remove Step 1' }));
    expect(screen.queryByRole('listitem', { name: 'Step 3' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Move Step 1 up' })).toBeDisabled();
    expect(screen.getByRole('button', { name: 'Move Step 2 down' })).toBeDisabled();

    await save();
    const body = await patched();
    expect(body.steps?.map((s) => s.text)).toEqual(['Pour onto ice.', 'Warm on the water bath.']);
    // A decimal comma is read as the reader writes it.
    expect(body.steps?.[0]).toMatchObject({ durationMinutes: 2.5, lineIndex: null });
    expect(body.steps?.[1]).toMatchObject({
      temperatureLowC: 50,
      temperatureHighC: 60,
      holdPoint: 'the solid has dissolved',
    });
  });

  it('when the buttons are used from the keyboard, then the moved step keeps the focus', async () => {
    const user = userEvent.setup();
    await openEditor();
    screen.getByRole('button', { name: 'Move Step 1 down' }).focus();
    await user.keyboard('{Enter}');
    expect(stepText('Step 2')).toBe('Add the anhydride to the acid.');
    await waitFor(() =>
      expect(screen.getByRole('button', { name: 'Move Step 2 up' })).toHaveFocus(),
    );
  });

  it('when a line before the step’s line is removed, then the step still adds the same chemical; when its own line is removed, then a note says so and it saves without a line', async () => {
    const user = userEvent.setup();
    const { patched } = await openEditor();
    const first = screen.getByRole('listitem', { name: 'Step 1' });
    const select = within(first).getByLabelText(/Line added in this step/) as HTMLSelectElement;
    expect(select.selectedOptions[0]).toHaveTextContent('Line 2: Acetic anhydride');

    await user.click(screen.getByRole('button', { name: 'Remove Line 1' }));
    expect(select.selectedOptions[0]).toHaveTextContent('Line 1: Acetic anhydride');
    expect(within(first).queryByRole('status')).toBeNull();

    await user.click(screen.getByRole('button', { name: 'Remove Line 1' }));
    expect(within(first).getByRole('status')).toHaveTextContent(
      'The line this step added was removed',
    );
    expect(select.value).toBe('');

    await save();
    const body = await patched();
    expect(body.steps?.[0]).toMatchObject({ lineIndex: null, addition: 'in one portion' });
  });

  it('when the server refuses a step field, then its message shows at that field of that step', async () => {
    await openEditor({
      status: 422,
      body: {
        error: {
          code: 'validation_failed',
          message: 'Check the steps.',
          fields: {
            'steps.1.durationMinutes': 'must be more than 0 minutes',
            'steps.0.lineIndex': 'points at line 4, but the procedure has 3',
          },
        },
      },
    });
    await save();
    const second = await screen.findByRole('listitem', { name: 'Step 2' });
    const time = within(second).getByLabelText(/Time \(min\)/);
    await waitFor(() => expect(time).toHaveAttribute('aria-invalid', 'true'));
    expect(within(second).getByText('The time must be more than 0 minutes')).toBeInTheDocument();
    const first = screen.getByRole('listitem', { name: 'Step 1' });
    expect(
      within(first).getByText('Points at line 4, but the procedure has 3'),
    ).toBeInTheDocument();
    expect(screen.getByText(/Check the steps\. Nothing was saved\./)).toBeInTheDocument();
  });
});
