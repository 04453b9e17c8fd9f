import { UniqueConstraintError } from 'sequelize';
import { BUILT_IN_DECK_PROFILES, type DeckProfile, type DeckProfileInput, type DeckProfileRename } from '../../shared/schemas/deck-profile.schema';
import { AppError } from '../errors/app-error';
import type { Db } from '../models/models';
import type { DeckProfileAttributes } from '../models/deck-profile.model';

// The deck profile library: the built-in profiles (read-only) and the firm's own (engineers and
// owners add, change and remove them). A deck keeps a copy of the build-up it was set from, so
// editing the library never changes a saved plan.

interface ProfilesCtx {
  db: Db;
}

function view(r: DeckProfileAttributes): DeckProfile {
  const slab = typeof r.slab === 'string' ? JSON.parse(r.slab) : r.slab;
  return { id: r.id, name: r.name, slab, builtIn: false };
}

/** The built-ins first, then the firm's own by name. */
export async function listDeckProfiles(ctx: ProfilesCtx, firmId: string): Promise<DeckProfile[]> {
  const rows = await ctx.db.models.DeckProfile.findAll({ where: { firmId }, order: [['name', 'ASC']] });
  return [...BUILT_IN_DECK_PROFILES, ...rows.map((r) => view(r.get({ plain: true })))];
}

/**
 * A name is free when no built-in and no other profile of the firm has it, letter case aside
 * (two entries in the picker differing only in case would read as one). The unique index on
 * (firm_id, name) still catches an exact clash between two concurrent writes.
 */
async function ensureNameFree(ctx: ProfilesCtx, firmId: string, name: string, exceptId?: string): Promise<void> {
  const lower = name.toLowerCase();
  const builtIn = BUILT_IN_DECK_PROFILES.some((p) => p.name.toLowerCase() === lower);
  // Compared here, not in SQL: JavaScript folds every letter's case (SQLite's lower() only ASCII),
  // and a name with any character at all (NUL included) is only ever a bound value.
  const firmProfiles = await ctx.db.models.DeckProfile.findAll({ where: { firmId }, attributes: ['id', 'name'] });
  const taken = firmProfiles.filter((r) => String(r.getDataValue('name')).toLowerCase() === lower);
  if (builtIn || taken.some((r) => r.getDataValue('id') !== exceptId)) {
    throw AppError.conflict('deck_profile_name_taken', 'A deck profile with this name already exists.', { name: 'A deck profile with this name already exists' });
  }
}

export async function createDeckProfile(ctx: ProfilesCtx, actor: { firmId: string; userId: string | null }, input: DeckProfileInput): Promise<DeckProfile> {
  await ensureNameFree(ctx, actor.firmId, input.name);
  try {
    const now = new Date();
    const row = await ctx.db.models.DeckProfile.create({ firmId: actor.firmId, name: input.name, slab: input.slab, userId: actor.userId, createdAt: now, updatedAt: now });
    return view(row.get({ plain: true }));
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw AppError.conflict('deck_profile_name_taken', 'A deck profile with this name already exists.', { name: 'A deck profile with this name already exists' });
    throw error;
  }
}

async function ownProfile(ctx: ProfilesCtx, firmId: string, id: string, action: 'change' | 'delete') {
  if (id.startsWith('builtin:')) {
    throw action === 'change'
      ? AppError.badRequest('Built-in deck profiles cannot be changed; save a copy under a new name.', { id: 'Built-in deck profiles cannot be changed' })
      : AppError.badRequest('Built-in deck profiles cannot be deleted.', { id: 'Built-in deck profiles cannot be deleted' });
  }
  const row = await ctx.db.models.DeckProfile.findOne({ where: { id, firmId } });
  if (!row) throw AppError.notFound('Deck profile');
  return row;
}

export async function updateDeckProfile(ctx: ProfilesCtx, actor: { firmId: string; userId: string | null }, id: string, input: DeckProfileInput | DeckProfileRename): Promise<DeckProfile> {
  const row = await ownProfile(ctx, actor.firmId, id, 'change');
  await ensureNameFree(ctx, actor.firmId, input.name, id);
  try {
    // A rename (no slab given) leaves the stored build-up as it is.
    await row.update({ name: input.name, ...('slab' in input ? { slab: input.slab } : {}), userId: actor.userId, updatedAt: new Date() });
  } catch (error) {
    // Another write took the name between the check and this one.
    if (error instanceof UniqueConstraintError) throw AppError.conflict('deck_profile_name_taken', 'A deck profile with this name already exists.', { name: 'A deck profile with this name already exists' });
    throw error;
  }
  return view(row.get({ plain: true }));
}

export async function deleteDeckProfile(ctx: ProfilesCtx, firmId: string, id: string): Promise<void> {
  const row = await ownProfile(ctx, firmId, id, 'delete');
  await row.destroy();
}
