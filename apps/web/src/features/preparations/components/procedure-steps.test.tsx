import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { ProcedureStepView } from '@lotwise/shared';
import { ProcedureSteps } from './procedure-steps';

const step = (overrides: Partial<ProcedureStepView>): ProcedureStepView => ({
  index: 0,
  text: 'Stir.',
  durationMinutes: null,
  temperatureLowC: null,
  temperatureHighC: null,
  outsideWindow: '',
  lineIndex: null,
  addition: '',
  caution: null,
  holdPoint: '',
  ...overrides,
});

const steps = [
  step({
    index: 0,
    text: 'Add the nitrite solution to the cold amine.',
    lineIndex: 1,
    addition: 'dropwise over about 20 min',
    temperatureLowC: 5,
    temperatureHighC: 7,
    outsideWindow: 'stop the addition and add ice to the bath',
    caution: 'exothermicAddition',
  }),
  step({ index: 1, text: 'Let it stand.', durationMinutes: 240, temperatureHighC: 30 }),
  step({ index: 2, text: 'Filter.', holdPoint: 'the mixture is below 10 °C' }),
];
// The page's own per-bench text for each line: the component shows it as given.
const lines = [
  { lineIndex: 0, name: 'Aniline', amount: '0.93 g' },
  { lineIndex: 1, name: 'Sodium nitrite solution 2 M', amount: '5.3 mL' },
];

describe('Procedure steps', () => {
  it('when a step adds a line with a window, then it names the chemical with the scaled amount, the window and what to do outside it', () => {
    render(<ProcedureSteps id="steps" steps={steps} lines={lines} />);
    const first = screen.getByRole('listitem', { name: 'Step 1' });
    expect(first).toHaveTextContent(
      'Add: Sodium nitrite solution 2 M — 5.3 mL, dropwise over about 20 min',
    );
    expect(first).toHaveTextContent('Keep the temperature: 5–7 °C');
    expect(first).toHaveTextContent('Outside it: stop the addition and add ice to the bath');
    expect(first).toHaveTextContent('Caution: Exothermic addition');
    const second = screen.getByRole('listitem', { name: 'Step 2' });
    expect(second).toHaveTextContent('Time: 4 h');
    expect(second).toHaveTextContent('Keep the temperature: at most 30 °C');
    expect(within(second).queryByText(/Add:/)).toBeNull();
  });

  it('when a step has a hold point, then it reads "Hold point: do not go on until …" in its own box', () => {
    render(<ProcedureSteps id="steps" steps={steps} lines={lines} />);
    const third = screen.getByRole('listitem', { name: 'Step 3' });
    expect(within(third).getByTestId('hold-point-2')).toHaveTextContent(
      'Hold point: do not go on until the mixture is below 10 °C',
    );
    expect(screen.getAllByTestId(/^hold-point-/)).toHaveLength(1);
  });

  it('when no scale is known for the line, then the chemical is named without an amount', () => {
    render(
      <ProcedureSteps
        id="steps"
        steps={steps.slice(0, 1)}
        lines={[{ lineIndex: 1, name: 'Sodium nitrite solution 2 M' }]}
      />,
    );
    expect(screen.getByRole('listitem', { name: 'Step 1' })).toHaveTextContent(
      'Add: Sodium nitrite solution 2 M, dropwise over about 20 min',
    );
  });

  it('when the procedure has no steps, then nothing is shown unless a hint is given', () => {
    const { container, rerender } = render(<ProcedureSteps id="steps" steps={[]} lines={lines} />);
    expect(container).toBeEmptyDOMElement();
    rerender(<ProcedureSteps id="steps" steps={[]} lines={lines} empty={<p>No steps yet.</p>} />);
    expect(screen.getByText('No steps yet.')).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Steps' })).toBeNull();
  });
});
