import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { StockAmount, TakeAmount } from './stock-amount';

describe('StockAmount', () => {
  it('when an amount of stock is shown, then it reads as everywhere else: its own unit, balance precision', () => {
    render(
      <>
        <StockAmount value={0.852} unit="mL" testId="small" />
        <StockAmount value={2698.471} unit="mL" testId="large" />
        <StockAmount value={250} unit="g" testId="mass" />
      </>,
    );
    expect(screen.getByTestId('small')).toHaveTextContent('0.852 mL');
    expect(screen.getByTestId('large')).toHaveTextContent('2,698.47 mL');
    expect(screen.getByTestId('mass')).toHaveTextContent('250.00 g');
  });
});

describe('TakeAmount', () => {
  it('when a container holding 34.947 mL is emptied, then the take says all, never 35.0 mL', () => {
    render(<TakeAmount take={34.947} holds={34.947} unit="mL" testId="take" />);
    expect(screen.getByTestId('take')).toHaveTextContent('all (34.95 mL)');
    expect(screen.getByTestId('take')).not.toHaveTextContent('35.0');
  });

  it('when part of a container is taken, then the take is rounded down and never exceeds the content', () => {
    render(
      <>
        <TakeAmount take={34.9469} holds={34.947} unit="mL" testId="almost" />
        <TakeAmount take={9.9999} holds={50} unit="mL" testId="part" />
      </>,
    );
    expect(screen.getByTestId('almost')).toHaveTextContent('34.94 mL');
    expect(screen.getByTestId('part')).toHaveTextContent('9.99 mL');
  });
});
