import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { Field } from './field';
import { Input } from './input';

describe('Field', () => {
  it('when it has a hint, then the control is named by its label and described by the hint', () => {
    render(
      <Field label="Tare" hint="The empty container with its cap">
        {(control) => <Input {...control} />}
      </Field>,
    );
    const input = screen.getByRole('textbox', { name: 'Tare' });
    expect(input).toHaveAccessibleDescription('The empty container with its cap');
    expect(input).not.toHaveAttribute('aria-invalid');
  });

  it('when it has an error, then the control is marked invalid and the error is read first', () => {
    render(
      <Field label="Amount taken" hint="In the container's unit" error="Amount taken is required">
        {(control) => <Input {...control} />}
      </Field>,
    );
    const input = screen.getByRole('textbox', { name: 'Amount taken' });
    expect(input).toHaveAttribute('aria-invalid', 'true');
    expect(input).toHaveAccessibleDescription("Amount taken is required In the container's unit");
  });

  it('when it is optional, then the label says so in words', () => {
    render(
      <Field label="Note" optional>
        {(control) => <Input {...control} />}
      </Field>,
    );
    expect(screen.getByRole('textbox', { name: /^Note ?\(optional\)$/ })).toBeInTheDocument();
  });
});
