import type { Sequelize } from 'sequelize';

// How a design run's result is stored. The engine shares one sizing record between members
// whose design inputs are equal (a typical floor repeats a few dozen), and the `calc plan`
// output repeats it per member; stored runs keep each distinct record once (`designs`) and
// each member points at it by index. Reading a run gives back the output exactly as the
// engine wrote it (same keys, same order, same numbers). Rows written before this format
// carry the plain output and are read as they are.

/** Marks a packed result; older rows have no such key. */
const PACKED_VERSION = 2;

export interface PackedResult {
  storageVersion: typeof PACKED_VERSION;
  /** Each distinct member sizing record once. */
  designs: unknown[];
  /** The output with each member's `design` replaced by its index in `designs` (null stays null). */
  result: Record<string, unknown> & { members?: Record<string, unknown>[] };
}

const isPacked = (stored: unknown): stored is PackedResult =>
  typeof stored === 'object' && stored !== null && (stored as { storageVersion?: unknown }).storageVersion === PACKED_VERSION;

/** The stored form of a design result (plain JSON values; the engine's non-enumerable caches are dropped); `json` is JSON.stringify(result) when the caller has it. */
export function packDesignResult(result: unknown, json?: string): PackedResult {
  if (isPacked(result)) return result;
  const plain = JSON.parse(json ?? JSON.stringify(result)) as PackedResult['result'];
  const designs: unknown[] = [];
  const indexByText = new Map<string, number>();
  const members = (plain.members ?? []).map((m) => {
    if (!('design' in m) || m.design === null || m.design === undefined) return m;
    const text = JSON.stringify(m.design);
    let index = indexByText.get(text);
    if (index === undefined) {
      index = designs.length;
      designs.push(m.design);
      indexByText.set(text, index);
    }
    return { ...m, design: index };
  });
  return { storageVersion: PACKED_VERSION, designs, result: plain.members ? { ...plain, members } : plain };
}

/** The design result a stored value holds: unpacked, or as stored for rows of the older format. */
export function unpackDesignResult(stored: unknown): Record<string, unknown> {
  const value = typeof stored === 'string' ? (JSON.parse(stored) as unknown) : stored;
  if (!isPacked(value)) return value as Record<string, unknown>;
  const { designs, result } = value;
  if (!result.members) return result;
  return {
    ...result,
    members: result.members.map((m) => (typeof m.design === 'number' ? { ...m, design: designs[m.design] } : m)),
  };
}

/** What an older run keeps once its result is pruned (its summary columns stay). */
export const PRUNED_RESULT = Object.freeze({ pruned: true });

const DEFAULT_RUNS_KEPT = 5;
const runsKeptByDatabase = new WeakMap<Sequelize, number>();

/** The number of full design results kept per scheme on this database (config DESIGN_RUNS_KEPT). */
export function setDesignRunsKept(sequelize: Sequelize, kept: number): void {
  runsKeptByDatabase.set(sequelize, kept);
}

export function designRunsKept(sequelize: Sequelize): number {
  return runsKeptByDatabase.get(sequelize) ?? DEFAULT_RUNS_KEPT;
}
