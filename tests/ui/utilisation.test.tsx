import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { UtilisationChip } from '../../src/components/ui/utilisation-chip.ui';
import { formatRatio, utilisation, utilisationBand } from '../../src/lib/utilisation';

describe('utilisation ramp', () => {
  it('when the ratio sits in each band, then it returns that band and its label', () => {
    expect(utilisation(0.32)).toMatchObject({ band: 'spare', label: 'Spare', printed: '0.32', passes: true });
    expect(utilisation(0.5)).toMatchObject({ band: 'spare', printed: '0.50' });
    expect(utilisation(0.74)).toMatchObject({ band: 'working', label: 'Working', printed: '0.74', passes: true });
    expect(utilisation(0.9)).toMatchObject({ band: 'working', printed: '0.90' });
    expect(utilisation(0.96)).toMatchObject({ band: 'near', label: 'Near limit', printed: '0.96', passes: true });
    expect(utilisation(1)).toMatchObject({ band: 'near', printed: '1.00', passes: true });
    expect(utilisation(1.18)).toMatchObject({ band: 'over', label: 'Over', printed: '1.18', passes: false });
  });

  it('when a ratio is just over 1, then it is over and never printed as 1.00', () => {
    expect(utilisation(1.0004)).toMatchObject({ band: 'over', printed: '1.01' });
    expect(utilisation(1 + Number.EPSILON)).toMatchObject({ band: 'over', printed: '1.01' });
  });

  it('when printing, then the ratio is rounded up, not down, but binary noise is ignored', () => {
    expect(formatRatio(0.951)).toBe('0.96');
    expect(formatRatio(0.1 * 7)).toBe('0.70');
    expect(formatRatio(0)).toBe('0.00');
    expect(formatRatio(12.3)).toBe('>9.99');
  });

  it('when there is no usable ratio, then the band is "none" or "over" and a printed value still exists', () => {
    expect(utilisation(Number.NaN)).toMatchObject({ band: 'none', printed: '—', label: 'No result' });
    expect(utilisation(-0.2)).toMatchObject({ band: 'none', printed: '—' });
    expect(utilisation(Number.POSITIVE_INFINITY)).toMatchObject({ band: 'over', printed: '>9.99' });
    expect(utilisationBand(Number.POSITIVE_INFINITY)).toBe('over');
  });

  it('when given a band, then its colour comes from the ramp tokens', () => {
    expect(utilisation(0.96).colour).toBe('var(--color-util-near)');
    expect(utilisation(1.2).inkColour).toBe('var(--color-util-over-ink)');
  });

  it('when the chip renders, then the printed ratio and band words are visible, not colour alone', () => {
    render(<UtilisationChip ratio={0.873} />);
    expect(screen.getByText('0.88')).toBeInTheDocument();
    expect(screen.getByText('Working')).toBeInTheDocument();
    expect(screen.getByTitle('Utilisation 0.88 (Working)')).toHaveStyle({ backgroundColor: 'var(--color-util-working)' });
  });
});
