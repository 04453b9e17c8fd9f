// The reader's choice of display units (US customary by default, SI on request), kept in
// localStorage so it survives reloads and is shared by every tab.
//
//   const { system, setSystem } = useUnits();
//   formatQuantity('moment_kipft', m.Mr_kipft, system)
//
// A <UnitsProvider system="SI"> fixes the choice for a subtree (tests, printed sheets); without
// one the hook reads and writes the stored choice.
import { createContext, useCallback, useContext, useId, useSyncExternalStore, type ReactNode } from 'react';
import { DEFAULT_UNIT_SYSTEM, isUnitSystem, unitLabel, type UnitSystem } from './units';

export const UNITS_STORAGE_KEY = 'baywright.units';

const listeners = new Set<() => void>();

function safeStorage(): Storage | null {
  try {
    return typeof window !== 'undefined' ? window.localStorage : null;
  } catch {
    return null; // storage blocked (privacy settings): fall back to the default
  }
}

/** The stored choice; anything unreadable or unknown is the default. */
export function readStoredUnitSystem(): UnitSystem {
  try {
    const value = safeStorage()?.getItem(UNITS_STORAGE_KEY);
    return isUnitSystem(value) ? value : DEFAULT_UNIT_SYSTEM;
  } catch {
    return DEFAULT_UNIT_SYSTEM;
  }
}

export function storeUnitSystem(system: UnitSystem): void {
  try {
    safeStorage()?.setItem(UNITS_STORAGE_KEY, system);
  } catch {
    // Quota or privacy mode: the choice lasts for this page only.
  }
  listeners.forEach((l) => l());
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  const onStorage = (e: StorageEvent) => {
    if (e.key === UNITS_STORAGE_KEY) listener();
  };
  if (typeof window !== 'undefined') window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    if (typeof window !== 'undefined') window.removeEventListener('storage', onStorage);
  };
}

interface UnitsValue {
  system: UnitSystem;
  setSystem: (system: UnitSystem) => void;
}

const FixedUnits = createContext<UnitsValue | null>(null);

/** Fixes the unit system for a subtree; onChange receives the reader's switch. */
export function UnitsProvider({ system, onChange, children }: { system: UnitSystem; onChange?: (s: UnitSystem) => void; children: ReactNode }) {
  return <FixedUnits.Provider value={{ system, setSystem: onChange ?? (() => undefined) }}>{children}</FixedUnits.Provider>;
}

export function useUnits(): UnitsValue {
  const fixed = useContext(FixedUnits);
  const stored = useSyncExternalStore(subscribe, readStoredUnitSystem, () => DEFAULT_UNIT_SYSTEM);
  const setStored = useCallback((s: UnitSystem) => storeUnitSystem(s), []);
  return fixed ?? { system: stored, setSystem: setStored };
}

/** A two-way switch for the header or a sheet: US customary | SI. */
export function UnitsSwitch({ className = '' }: { className?: string }) {
  const { system, setSystem } = useUnits();
  const name = useId();
  return (
    <fieldset className={`inline-flex items-center gap-0 rounded-[3px] border border-ink/60 text-xs ${className}`}>
      <legend className="sr-only">Display units</legend>
      {(['US', 'SI'] as const).map((s) => (
        <label
          key={s}
          className={`cursor-pointer px-2 py-1 font-mono ${system === s ? 'bg-ink text-paper-raised' : 'text-ink-soft hover:bg-paper-sunk'}`}
          title={s === 'US' ? `US customary (${unitLabel('force_kip', 'US')}, ${unitLabel('length_ft', 'US')})` : `SI (${unitLabel('force_kip', 'SI')}, ${unitLabel('length_ft', 'SI')})`}
        >
          <input type="radio" name={name} value={s} checked={system === s} onChange={() => setSystem(s)} className="sr-only" />
          {s === 'US' ? 'US' : 'SI'}
        </label>
      ))}
    </fieldset>
  );
}
