import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ghsCodes, ghsPictograms, safetyDeferral } from '@lotwise/shared';
import { HazardStatementList } from './hazard-statement-list';
import { PictogramBadge, PictogramList } from './pictogram-badge';
import { SafetyCaution } from './safety-caution';

describe('PictogramBadge', () => {
  it.each(ghsCodes)(
    'when %s is shown compact, then its code is visible and its meaning is accessible text',
    (code) => {
      const { container } = render(<PictogramBadge code={code} />);
      const badge = container.firstElementChild as HTMLElement;

      expect(badge).toHaveTextContent(code);
      expect(badge).toHaveTextContent(ghsPictograms[code].meaning);
      expect(badge).toHaveTextContent(ghsPictograms[code].symbol);
      // The drawing is decoration; the words carry the meaning.
      expect(container.querySelector('svg')).toHaveAttribute('aria-hidden', 'true');
    },
  );

  it('when shown large, then code, symbol name and meaning are all visible text', () => {
    render(<PictogramBadge code="GHS05" size="lg" />);

    expect(screen.getByText('GHS05')).toBeVisible();
    expect(screen.getByText('Corrosion')).toBeVisible();
    expect(screen.getByText('Corrosive to skin, eyes or metals')).toBeVisible();
  });

  it('when a chemical has pictograms, then they form a labelled list', () => {
    render(<PictogramList codes={['GHS02', 'GHS07']} />);

    const list = screen.getByRole('list', { name: 'GHS pictograms' });
    expect(within(list).getAllByRole('listitem')).toHaveLength(2);
    expect(list).toHaveTextContent('GHS02 Flame: Flammable');
  });
});

describe('HazardStatementList', () => {
  it('when a code is known, then its text shows; when unknown, then it points to the SDS', () => {
    render(<HazardStatementList codes={['H225', 'H999']} />);

    expect(screen.getByText('Highly flammable liquid and vapour')).toBeInTheDocument();
    expect(screen.getByText(/see SDS/)).toBeInTheDocument();
  });
});

describe('SafetyCaution', () => {
  it('shows the shared deferral to the SDS, local regulations and licensed practice', () => {
    render(<SafetyCaution />);
    expect(screen.getByText(safetyDeferral)).toBeInTheDocument();
  });
});
