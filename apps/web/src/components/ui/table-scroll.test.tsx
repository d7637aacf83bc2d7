import { render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { TableScroll } from './table-scroll';

function widths(scrollWidth: number, clientWidth: number) {
  vi.spyOn(HTMLElement.prototype, 'scrollWidth', 'get').mockReturnValue(scrollWidth);
  vi.spyOn(HTMLElement.prototype, 'clientWidth', 'get').mockReturnValue(clientWidth);
}

function renderTable() {
  render(
    <TableScroll label="Ledger">
      <table aria-label="Ledger">
        <tbody>
          <tr>
            <td>LW-00014</td>
          </tr>
        </tbody>
      </table>
    </TableScroll>,
  );
}

describe('TableScroll', () => {
  afterEach(() => {
    vi.restoreAllMocks();
  });

  it('when the table is wider than the screen, then its frame is a named stop for the keyboard', () => {
    widths(900, 390); // the browser's own layout numbers, which jsdom does not compute
    renderTable();
    const region = screen.getByRole('region', { name: 'Ledger' });
    expect(region).toHaveAttribute('tabindex', '0');
  });

  it('when the table fits, then its frame is no stop on the way through the page', () => {
    widths(800, 1280);
    renderTable();
    expect(screen.queryByRole('region')).not.toBeInTheDocument();
    expect(screen.getByRole('table').parentElement).not.toHaveAttribute('tabindex');
  });
});
