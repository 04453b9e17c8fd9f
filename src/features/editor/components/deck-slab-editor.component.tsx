/**
 * The slab build-up of one deck (plan file decks[].slab): picked from the deck profile library
 * (built-ins of Baywright's own naming and the firm's own) and edited field by field, with the
 * resulting slab dead load and its arithmetic (design-basis §1: concrete above the ribs plus the
 * ribs' share, times the unit weight, plus the deck). Roles that cannot edit read it.
 */
import { useId, useState } from 'react';
import { slabWeight } from '../../../../shared/engine/index';
import { DECK_SLAB_BOUNDS, DECK_SLAB_FIELDS, deckSlabSchema, type DeckProfile, type DeckSlabField } from '../../../../shared/schemas/deck-profile.schema';
import type { PlanSlab } from '../../../../shared/schemas/plan.schema';

const INPUT = 'h-8 w-16 rounded-[3px] border border-line bg-paper-raised px-2 text-xs figures font-mono text-ink focus:border-accent focus:outline-none';

export interface DeckSlabEditorProps {
  slab: PlanSlab | null;
  profiles: readonly DeckProfile[];
  canEdit: boolean;
  onChange: (slab: PlanSlab | null) => void;
  /** Save the current build-up to the firm's library under a name; absent hides it. */
  onSaveProfile?: (name: string, slab: PlanSlab) => Promise<unknown>;
}

function withoutProfile(slab: PlanSlab): Omit<PlanSlab, 'profile'> {
  const { profile: _p, ...rest } = slab;
  return rest;
}

export function DeckSlabEditor({ slab, profiles, canEdit, onChange, onSaveProfile }: DeckSlabEditorProps) {
  const ids = useId();
  const [errors, setErrors] = useState<Partial<Record<DeckSlabField, string>>>({});
  const [profileName, setProfileName] = useState('');
  const [saveMessage, setSaveMessage] = useState<string | null>(null);

  const commit = (field: DeckSlabField, text: string) => {
    if (!slab || !canEdit) return;
    const value = text.trim() === '' ? Number.NaN : Number(text);
    const next = { ...withoutProfile(slab), [field]: value };
    const parsed = deckSlabSchema.safeParse(next);
    if (!parsed.success) {
      const out: Partial<Record<DeckSlabField, string>> = {};
      for (const issue of parsed.error.issues) out[issue.path[0] as DeckSlabField] ??= issue.message;
      setErrors(out);
      return; // the plan keeps its last valid build-up
    }
    setErrors({});
    if (parsed.data[field] !== slab[field]) onChange({ ...parsed.data }); // edited: no longer the library profile as it was
  };

  const weight = slab ? slabWeight(slab) : null;
  return (
    <div className="flex w-full flex-col gap-2" role="group" aria-label="Slab build-up">
      <div className="flex flex-wrap items-center gap-2">
        <label className="flex items-center gap-1" htmlFor={`${ids}-profile`}>
          Slab
        </label>
        <select
          id={`${ids}-profile`}
          disabled={!canEdit}
          className="h-8 max-w-[22rem] rounded-[3px] border border-line bg-paper-raised px-1 text-xs"
          value={slab ? (profiles.find((p) => p.name === slab.profile)?.id ?? 'custom') : 'none'}
          onChange={(e) => {
            setErrors({});
            if (e.target.value === 'none') return onChange(null);
            const p = profiles.find((x) => x.id === e.target.value);
            if (p) onChange({ ...p.slab, profile: p.name });
          }}
        >
          <option value="none">No slab (zone dead load, bare steel)</option>
          {slab && !profiles.some((p) => p.name === slab.profile) ? <option value="custom">{slab.profile ? `${slab.profile} (no longer in the library; the deck keeps its build-up)` : 'Own build-up'}</option> : null}
          {profiles.map((p) => (
            <option key={p.id} value={p.id}>
              {p.builtIn ? p.name : `${p.name} (firm)`}
            </option>
          ))}
        </select>
      </div>
      {slab ? (
        <>
          <div className="flex flex-wrap gap-x-3 gap-y-1">
            {DECK_SLAB_FIELDS.map((f) => (
              <span key={f} className="flex flex-col gap-0.5">
                <label className="flex items-center gap-1">
                  {DECK_SLAB_BOUNDS[f].label}, {DECK_SLAB_BOUNDS[f].unit}
                  <input
                    key={`${f}${slab[f]}`}
                    readOnly={!canEdit}
                    className={INPUT}
                    inputMode="decimal"
                    defaultValue={String(slab[f])}
                    aria-invalid={errors[f] ? true : undefined}
                    aria-describedby={errors[f] ? `${ids}-${f}-error` : undefined}
                    onBlur={(e) => commit(f, e.target.value)}
                    onKeyDown={(e) => {
                      if (e.key === 'Enter') e.currentTarget.blur();
                    }}
                  />
                </label>
                {errors[f] ? (
                  <span id={`${ids}-${f}-error`} className="text-xs text-danger" aria-live="polite">
                    {errors[f]}
                  </span>
                ) : null}
              </span>
            ))}
          </div>
          {weight ? (
            <p className="figures font-mono text-xs text-ink" data-testid="slab-dead-load">
              Slab dead load {weight.total_psf.toFixed(1)} psf: {weight.text}. It replaces the zone’s dead load under this deck.
            </p>
          ) : null}
          {canEdit && onSaveProfile ? (
            <form
              className="flex flex-wrap items-center gap-2"
              aria-label="Save slab to the library"
              onSubmit={(e) => {
                e.preventDefault();
                if (!profileName.trim()) return setSaveMessage('Name the profile first');
                onSaveProfile(profileName.trim(), slab)
                  .then(() => {
                    setSaveMessage(`Saved “${profileName.trim()}” to the firm’s deck profiles.`);
                    setProfileName('');
                  })
                  .catch((err: unknown) => setSaveMessage(err instanceof Error ? err.message : 'Could not save the profile'));
              }}
            >
              <label className="flex items-center gap-1">
                Profile name
                <input className="h-8 w-56 rounded-[3px] border border-line bg-paper-raised px-2 text-xs" value={profileName} maxLength={120} onChange={(e) => setProfileName(e.target.value)} />
              </label>
              <button type="submit" className="h-8 rounded-[3px] border border-ink px-2 text-xs">
                Save to library
              </button>
              {saveMessage ? <span className="text-xs text-ink-soft" role="status">{saveMessage}</span> : null}
            </form>
          ) : null}
        </>
      ) : null}
    </div>
  );
}
