import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Comparison, ComparisonScheme } from '../../src/features/tonnage/api/get-comparison.api';
import { ComparisonView } from '../../src/features/tonnage/components/comparison-view.component';
import { UnitsProvider } from '../../src/lib/units-context';
import type { UnitSystem } from '../../src/lib/units';

// Invented scenario: two schemes over the same 10,000 ft² floor.
function scheme(id: string, name: string, lb: number, status: ComparisonScheme['status'], cost_usd: number): ComparisonScheme {
  const figures = {
    steelWeight_lb: lb,
    steelWeight_tons: lb / 2000,
    steel_psf: lb / 10_000,
    pieces: 40,
    connections: 80,
    floorArea_ft2: 10_000,
    unsizedPieces: 0,
    studs: 0,
    camberedPieces: 0,
    cost_usd,
    steel_usd: cost_usd - 8000,
    connections_usd: 8000,
    studs_usd: null,
    camber_usd: null,
  };
  return { id, name, status, archived: false, totals: figures, byLevel: [{ ...figures, level: 'L2', levelName: 'Level 2' }], byKind: [{ ...figures, kind: 'beam' }] };
}

const comparison: Comparison = {
  project: { id: 'p1', name: 'Harbour Annex' },
  schemes: [scheme('a', 'Scheme A', 64_000, 'chosen', 120_000), scheme('b', 'Scheme B', 56_000, 'draft', 106_100)],
  prices: { prices: { steel_usd_per_ton: 3500, connection_usd_each: 100, stud_usd_each: null, camber_usd_each: null, example: true, setAt: '2026-11-01T00:00:00Z', setBy: null }, notYetPriced: ['Shear studs', 'Camber'] },
  basis: 'Weights from the designed sizes.',
  caution: 'A licensed engineer must check these results.',
  generatedAt: '2026-12-01T10:00:00Z',
};

function show(system: UnitSystem) {
  render(
    <UnitsProvider system={system}>
      <ComparisonView comparison={comparison} />
    </UnitsProvider>,
  );
}

describe('Tonnage in the reader units', () => {
  it('when US is shown, then weights read in tons and lb, steel per floor area in psf', () => {
    show('US');
    const card = screen.getByRole('article', { name: 'Scheme A' });
    expect(within(card).getByText('32.0 tons')).toBeInTheDocument(); // 64,000 lb ÷ 2000 lb/ton
    expect(within(card).getByText('64,000 lb')).toBeInTheDocument();
    expect(within(card).getByText('6.40 psf')).toBeInTheDocument(); // 64,000 lb ÷ 10,000 ft²
    expect(within(card).getByText('10,000 ft²')).toBeInTheDocument();
  });

  it('when SI is shown, then weights read in tonnes and kg, steel per floor area in kg/m², costs stay in dollars', () => {
    show('SI');
    const card = screen.getByRole('article', { name: 'Scheme A' });
    // 64,000 lb × 0.45359237 kg/lb = 29,029.9 kg = 29.0 tonnes (NIST SP 811, exact lb definition).
    expect(within(card).getByText('29.0 tonnes')).toBeInTheDocument();
    expect(within(card).getByText('29,030 kg')).toBeInTheDocument();
    // 6.40 lb/ft² × 4.882428 kg/m² per lb/ft² = 31.2 kg/m².
    expect(within(card).getByText('31.2 kg/m²')).toBeInTheDocument();
    // 10,000 ft² × 0.09290304 m²/ft² = 929 m².
    expect(within(card).getByText('929 m²')).toBeInTheDocument();
    expect(within(card).getByText('$120,000')).toBeInTheDocument();
    expect(within(card).queryByText(/tons|lb|psf/)).toBeNull();
  });

  it('when SI is shown, then the difference sentence and table speak tonnes and kg; the exports keep their links', () => {
    show('SI');
    // B − A = −8,000 lb = −3,628.7 kg = 3.6 tonnes lighter; −12.5 % → 13 %; −$13,900.
    expect(screen.getByTestId('difference-sentences')).toHaveTextContent('Scheme B is 3.6 tonnes (13 %) lighter and $13,900 cheaper than Scheme A.');
    const table = within(screen.getByRole('region', { name: /Against Scheme A/ })).getByRole('table');
    expect(within(table).getAllByRole('columnheader').map((h) => h.textContent)).toEqual(['Scheme', 'kg', 'tonnes', 'kg/m²', '%', 'pieces', 'cost']);
    const cells = within(within(table).getAllByRole('row')[1]).getAllByRole('cell').map((c) => c.textContent);
    // −0.80 lb/ft² × 4.882428 = −3.9 kg/m².
    expect(cells).toEqual(['Scheme B', '−3,629', '−3.6', '−3.9', '−12.5 %', '±0', '−$13,900']);
    expect(screen.getByRole('link', { name: 'Export CSV' })).toHaveAttribute('href', '/api/projects/p1/comparison.csv?schemes=a,b');
    expect(screen.getByTestId('price-basis')).toHaveTextContent('$3,500 per ton (short ton, 907.2 kg)');
  });
});

describe('Tonnage prices studs and camber', () => {
  it('when studs and camber are priced, then each scheme shows their cost lines and the basis names both prices', () => {
    // Invented scenario: 320 studs at $4.50 = $1,440; 12 cambered pieces at $350 = $4,200;
    // steel 28 tons at $3,500 = $98,000; 80 connections at $100 = $8,000 (hand arithmetic).
    const priced: Comparison = {
      ...comparison,
      schemes: [
        {
          ...scheme('c', 'Scheme C', 56_000, 'draft', 98_000 + 8_000 + 1_440 + 4_200),
          totals: {
            ...scheme('c', 'Scheme C', 56_000, 'draft', 0).totals!,
            studs: 320, camberedPieces: 12, steel_usd: 98_000, connections_usd: 8_000, studs_usd: 1_440, camber_usd: 4_200, cost_usd: 111_640,
          },
        },
      ],
      prices: { prices: { steel_usd_per_ton: 3500, connection_usd_each: 100, stud_usd_each: 4.5, camber_usd_each: 350, example: false, setAt: '2026-11-01T00:00:00Z', setBy: null }, notYetPriced: [] },
    };
    render(
      <UnitsProvider system="US">
        <ComparisonView comparison={priced} />
      </UnitsProvider>,
    );
    const card = screen.getByRole('article', { name: 'Scheme C' });
    const figure = (label: string) => within(card).getByText(label).nextElementSibling?.textContent;
    expect(figure('Shear studs')).toBe('320');
    expect(figure('Cambered pieces')).toBe('12');
    expect(figure('Shear studs cost')).toBe('$1,400'); // $1,440 to the nearest $100
    expect(figure('Camber cost')).toBe('$4,200');
    expect(figure('Steel cost')).toBe('$98,000');
    expect(figure('Estimated cost')).toBe('$111,600'); // $111,640 to the nearest $100
    expect(screen.getByTestId('price-basis')).toHaveTextContent('$4.50 per shear stud, $350 per cambered piece');
    expect(screen.getByTestId('price-basis')).not.toHaveTextContent('Not yet priced');
  });

  it('when prices are set but studs are not priced, then the studs cost reads "not priced", never $0', () => {
    render(
      <UnitsProvider system="US">
        <ComparisonView comparison={comparison} />
      </UnitsProvider>,
    );
    const card = screen.getByRole('article', { name: 'Scheme A' });
    expect(within(card).getByText('Shear studs cost').nextElementSibling?.textContent).toBe('not priced');
    expect(within(card).getByText('Camber cost').nextElementSibling?.textContent).toBe('not priced');
  });
});
