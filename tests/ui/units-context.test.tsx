import { act, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeEach, describe, expect, it } from 'vitest';
import { formatQuantity } from '../../src/lib/units';
import { UNITS_STORAGE_KEY, UnitsProvider, UnitsSwitch, readStoredUnitSystem, storeUnitSystem, useUnits } from '../../src/lib/units-context';

function Moment({ kipft }: { kipft: number }) {
  const { system } = useUnits();
  return <output aria-label="moment">{formatQuantity('moment_kipft', kipft, system)}</output>;
}

beforeEach(() => window.localStorage.clear());

describe('units context', () => {
  it('when nothing is stored, then US customary is shown', () => {
    render(<Moment kipft={100} />);
    expect(screen.getByLabelText('moment')).toHaveTextContent('100.0 kip·ft');
  });

  it('when the reader switches to SI, then values convert and the choice is stored', async () => {
    render(
      <>
        <UnitsSwitch />
        <Moment kipft={100} />
      </>,
    );
    await userEvent.click(screen.getByRole('radio', { name: 'SI' }));
    expect(screen.getByLabelText('moment')).toHaveTextContent('135.6 kN·m'); // 100 × 1.355 818 (NIST SP 811)
    expect(window.localStorage.getItem(UNITS_STORAGE_KEY)).toBe('SI');
    expect(readStoredUnitSystem()).toBe('SI');
  });

  it('when SI was stored earlier, then a new page starts in SI; a junk value falls back to US', () => {
    window.localStorage.setItem(UNITS_STORAGE_KEY, 'SI');
    const { unmount } = render(<Moment kipft={10} />);
    expect(screen.getByLabelText('moment')).toHaveTextContent('13.6 kN·m');
    unmount();
    window.localStorage.setItem(UNITS_STORAGE_KEY, 'metricish');
    render(<Moment kipft={10} />);
    expect(screen.getByLabelText('moment')).toHaveTextContent('10.0 kip·ft');
  });

  it('when another part of the page stores a choice, then every reader updates', () => {
    render(<Moment kipft={1} />);
    act(() => storeUnitSystem('SI'));
    expect(screen.getByLabelText('moment')).toHaveTextContent('1.4 kN·m');
  });

  it('when a provider fixes the system, then it wins over the stored choice', () => {
    window.localStorage.setItem(UNITS_STORAGE_KEY, 'SI');
    render(
      <UnitsProvider system="US">
        <Moment kipft={2} />
      </UnitsProvider>,
    );
    expect(screen.getByLabelText('moment')).toHaveTextContent('2.0 kip·ft');
  });
});
