/**
 * Occupancy presets for the Zone tool. Live loads from ASCE 7-16 Table 4.3-1 (recalled from
 * memory); every value is editable before it is applied. Dead load of slab and deck and the
 * superimposed dead load are common practice defaults, not code values.
 */
import type { PlanZone } from '../../../../shared/schemas/plan.schema';

export interface ZonePreset {
  key: string;
  label: string;
  zone: Omit<PlanZone, 'id'>;
  /** Where the numbers come from, shown beside the preset. */
  source: string;
}

/** Normal-weight slab on 3 in. composite deck, about 6.25 in. total (common practice). */
const SLAB_DEAD_PSF = 50;
/** Ceiling, mechanical and electrical allowance (common practice). */
const SUPERIMPOSED_PSF = 15;
/** ASCE 7-16 §4.3.2: partitions where their location may change and live load ≤ 80 psf. */
const PARTITION_PSF = 15;

const floor = (live_psf: number, partition_psf: number, liveReducible: boolean) => ({
  dead_psf: SLAB_DEAD_PSF,
  superimposedDead_psf: SUPERIMPOSED_PSF,
  partition_psf,
  live_psf,
  liveReducible,
  roofLive_psf: 0,
  snow_psf: 0,
});

export const ZONE_PRESETS: readonly ZonePreset[] = [
  { key: 'office', label: 'Office', zone: { name: 'Office', ...floor(50, PARTITION_PSF, true) }, source: 'ASCE 7-16 Table 4.3-1 offices 50 psf; partitions 15 psf §4.3.2' },
  { key: 'corridor-upper', label: 'Corridors above first floor', zone: { name: 'Corridors above first floor', ...floor(80, PARTITION_PSF, true) }, source: 'ASCE 7-16 Table 4.3-1 office buildings, corridors above first floor 80 psf; partitions 15 psf §4.3.2' },
  { key: 'lobby', label: 'Lobbies and first-floor corridors', zone: { name: 'Lobbies and first-floor corridors', ...floor(100, 0, true) }, source: 'ASCE 7-16 Table 4.3-1 lobbies and first-floor corridors 100 psf' },
  // §4.7.5: live loads in assembly uses are not reduced.
  { key: 'assembly-movable', label: 'Assembly, movable seats', zone: { name: 'Assembly, movable seats', ...floor(100, 0, false) }, source: 'ASCE 7-16 Table 4.3-1 assembly, movable seats 100 psf; not reduced §4.7.5' },
  { key: 'classroom', label: 'Classrooms', zone: { name: 'Classrooms', ...floor(40, PARTITION_PSF, true) }, source: 'ASCE 7-16 Table 4.3-1 schools, classrooms 40 psf; partitions 15 psf §4.3.2 (conservative)' },
  // §4.7.3: live loads over 100 psf are not reduced (the two-floor exception is not taken: conservative).
  { key: 'storage-light', label: 'Light storage', zone: { name: 'Light storage', ...floor(125, 0, false) }, source: 'ASCE 7-16 Table 4.3-1 storage warehouses, light 125 psf; not reduced §4.7.3' },
  { key: 'mechanical', label: 'Mechanical room', zone: { name: 'Mechanical room', ...floor(125, 0, false) }, source: 'Common practice (not in Table 4.3-1): 125 psf, not reduced; use the equipment weights where known' },
  { key: 'roof', label: 'Roof (ordinary flat)', zone: { name: 'Roof', dead_psf: 20, superimposedDead_psf: 10, partition_psf: 0, live_psf: 0, liveReducible: false, roofLive_psf: 20, snow_psf: 0 }, source: 'ASCE 7-16 Table 4.3-1 ordinary flat roofs Lr 20 psf; roof deck dead load common practice; add snow per Chapter 7' },
];

/** Tints for load areas on the plan, in order of the plan's zones. Pale so linework reads over them. */
export const ZONE_TINTS = ['#dfe6d3', '#e9dccb', '#d7e1e6', '#eadfe8', '#e8e3c4', '#dde0ee', '#e6d5d2', '#d6e6df'] as const;

export function zoneTint(index: number): string {
  return ZONE_TINTS[((index % ZONE_TINTS.length) + ZONE_TINTS.length) % ZONE_TINTS.length];
}
