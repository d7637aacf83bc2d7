import { render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { describe, expect, it } from 'vitest';
import type { ContainerHold } from '@lotwise/shared';
import { ContainerHolds, freeOf } from './container-holds';

const hold = (planId: number, quantity: number): ContainerHold => ({
  reservationId: planId * 10,
  planId,
  planTitle: `Plan ${planId}`,
  plannedOn: '2026-12-09',
  until: '2026-12-09',
  quantity,
  reservedQuantity: quantity,
  unit: 'mL',
});

describe('ContainerHolds', () => {
  it('when a container is held for another plan, then it says what is free and that drawing more asks', () => {
    const container = { quantity: 100, unit: 'mL', holds: [hold(2, 65)] };
    render(
      <MemoryRouter>
        <ContainerHolds container={container} compact ownPlanId={7} />
      </MemoryRouter>,
    );
    expect(screen.getByText(/Free to draw without asking/)).toHaveTextContent('35.00 mL');
    expect(screen.getByText(/Drawing more asks/)).toBeInTheDocument();
  });

  it('when a run is recorded from the plan that holds the container, then its own hold is free and nothing says it asks', () => {
    const container = { quantity: 100, unit: 'mL', holds: [hold(2, 65)] };
    render(
      <MemoryRouter>
        <ContainerHolds container={container} compact ownPlanId={2} />
      </MemoryRouter>,
    );
    expect(screen.getByText(/takes the hold without asking/)).toBeInTheDocument();
    expect(screen.queryByText(/Drawing more asks/)).not.toBeInTheDocument();
    expect(freeOf(container, 2)).toBe(100);
    expect(freeOf(container)).toBe(35);
  });
});
