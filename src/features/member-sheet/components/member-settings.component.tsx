// The Member sheet's bracing and deflection-limit section: the Lb and the limits the design
// used, each with where it comes from (set on this member, or the design basis), and for the
// roles that may change sizes, the controls that set them on the member.
import { useEffect, useId, useState } from 'react';
import { memberDeflectionLimits, type MemberDesignResult, type SchemeMember } from '../../../../shared/engine/index';
import type { PlanDesignBasis } from '../../../../shared/schemas/plan.schema';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { formatQuantity, unitLabel, type UnitSystem } from '../../../lib/units';
import {
  BRACING_MODE_LABELS, fromSettingsForm, toSettingsForm, type BracingMode, type MemberBracingSettings, type MemberSettingsErrors, type MemberSettingsForm,
} from '../lib/member-settings.model';

const FROM_MEMBER = 'set on this member';
const FROM_BASIS = 'from the design basis';

function bracingText(member: Pick<SchemeMember, 'bracing'>, units: UnitSystem): string {
  const b = member.bracing;
  if (b === 'continuous') return 'continuously braced';
  if (b === 'none' || b.points_ft.length === 0) return 'braced at the supports only';
  return `braced at ${b.points_ft.map((x) => formatQuantity('length_ft', x, units, { digits: 2 })).join(', ')}`;
}

const limitText = (n: number | null) => (n === null ? 'not checked' : `span/${n}`);

export interface MemberSettingsProps {
  member: SchemeMember;
  design: MemberDesignResult | null;
  designBasis: PlanDesignBasis;
  settings: MemberBracingSettings;
  units: UnitSystem;
  canEdit: boolean;
  onSettings: (settings: MemberBracingSettings) => void;
}

export function MemberSettingsPanel({ member, design, designBasis, settings, units, canEdit, onSettings }: MemberSettingsProps) {
  const limits = memberDeflectionLimits(designBasis, { deflectionLimits: settings.deflectionLimits });
  const basis = designBasis.deflectionLimits;
  const looser = (['live', 'total'] as const).filter((k) => limits.source[k] === 'member' && basis[k] !== null && limits[k]! < basis[k]!);
  const lbSource = settings.Lb_override_ft != null || settings.bracing ? FROM_MEMBER : FROM_BASIS;
  return (
    <div className="flex flex-col gap-3">
      <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" data-testid="member-settings-used">
        <dt className="text-ink-soft">Unbraced length L<sub>b</sub></dt>
        <dd data-testid="member-lb-used">
          <span className="figures font-mono text-ink">{design ? formatQuantity('length_ft', design.Lb_ft, units, { digits: 2 }) : '—'}</span>
          {design ? <span className="figures font-mono text-ink-soft"> · C<sub>b</sub> {design.Cb.toFixed(2)}</span> : null}
          <span className="text-ink-soft">
            {' '}
            ({settings.Lb_override_ft != null ? `Lb override ${formatQuantity('length_ft', settings.Lb_override_ft, units, { digits: 2 })} on every segment, Cb = 1.0; ` : ''}
            {bracingText(member, units)}; <span data-testid="member-lb-source">{lbSource}</span>)
          </span>
        </dd>
        <dt className="text-ink-soft">Live-load deflection limit</dt>
        <dd data-testid="member-live-limit-used">
          <span className="figures font-mono text-ink">{limitText(limits.live)}</span>{' '}
          <span className="text-ink-soft">({limits.source.live === 'member' ? FROM_MEMBER : FROM_BASIS})</span>
        </dd>
        <dt className="text-ink-soft">Total-load deflection limit</dt>
        <dd data-testid="member-total-limit-used">
          <span className="figures font-mono text-ink">{limitText(limits.total)}</span>{' '}
          <span className="text-ink-soft">({limits.source.total === 'member' ? FROM_MEMBER : FROM_BASIS})</span>
        </dd>
      </dl>
      {looser.length ? (
        <p className="text-sm text-notice" role="note">
          {looser.map((k) => `The ${k === 'live' ? 'live-load' : 'total-load'} limit set on this member (span/${limits[k]}) is looser than the design basis (span/${basis[k]}).`).join(' ')}{' '}
          Check that this is intended.
        </p>
      ) : null}
      {canEdit ? <MemberSettingsForm key={`${units}|${member.span_ft}|${JSON.stringify(settings)}`} settings={settings} spanFt={member.span_ft} units={units} onSettings={onSettings} /> : null}
    </div>
  );
}

function MemberSettingsForm({ settings, spanFt, units, onSettings }: { settings: MemberBracingSettings; spanFt: number; units: UnitSystem; onSettings: (s: MemberBracingSettings) => void }) {
  const id = useId();
  const initial = toSettingsForm(settings, spanFt, units);
  const [form, setForm] = useState<MemberSettingsForm>(initial);
  const [errors, setErrors] = useState<MemberSettingsErrors>({});
  useEffect(() => setErrors({}), [settings]);
  const dirty = JSON.stringify(form) !== JSON.stringify(initial);
  const set = (patch: Partial<MemberSettingsForm>) => setForm((f) => ({ ...f, ...patch }));
  const lengthUnit = unitLabel('length_ft', units);
  const hasOwn = settings.bracing !== null || settings.Lb_override_ft !== null || settings.deflectionLimits !== null;
  return (
    <form
      aria-label="Bracing and deflection limits"
      noValidate
      className="flex flex-col gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        const r = fromSettingsForm(form, spanFt, units);
        if (!r.ok) return setErrors(r.errors);
        setErrors({});
        onSettings(r.value);
      }}
    >
      <div className="flex flex-col gap-1.5">
        <label htmlFor={`${id}-mode`} className="text-sm font-medium text-ink">
          Compression flange braced
        </label>
        <select
          id={`${id}-mode`}
          value={form.mode}
          onChange={(e) => set({ mode: e.target.value as BracingMode })}
          className="h-10 rounded-[3px] border border-line bg-paper-raised px-2 text-sm"
        >
          {(Object.keys(BRACING_MODE_LABELS) as BracingMode[]).map((m) => (
            <option key={m} value={m}>
              {BRACING_MODE_LABELS[m]}
            </option>
          ))}
        </select>
      </div>
      {form.mode === 'points' ? (
        <TextField
          label={`Brace points from the start support (${lengthUnit})`}
          className="figures font-mono"
          placeholder="e.g. 8, 16, 24"
          value={form.points}
          error={errors.points}
          hint="Comma separated, strictly inside the span; these replace the framing points."
          onChange={(e) => set({ points: e.target.value })}
        />
      ) : null}
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField
          label={`Lb override (${lengthUnit})`}
          optional
          inputMode="decimal"
          className="figures font-mono"
          value={form.lbOverride}
          error={errors.lbOverride}
          hint="Every segment, with Cb = 1.0."
          onChange={(e) => set({ lbOverride: e.target.value })}
        />
        <TextField
          label="Live limit span/n, n"
          optional
          inputMode="decimal"
          className="figures font-mono"
          placeholder="design basis"
          value={form.liveLimit}
          error={errors.liveLimit}
          onChange={(e) => set({ liveLimit: e.target.value })}
        />
        <TextField
          label="Total limit span/n, n"
          optional
          inputMode="decimal"
          className="figures font-mono"
          placeholder="design basis"
          value={form.totalLimit}
          error={errors.totalLimit}
          onChange={(e) => set({ totalLimit: e.target.value })}
        />
      </div>
      <div className="flex gap-2">
        <Button type="submit" variant="secondary" disabled={!dirty}>
          Apply bracing and limits
        </Button>
        <Button variant="quiet" disabled={!hasOwn} onClick={() => onSettings({ bracing: null, Lb_override_ft: null, deflectionLimits: null })}>
          Follow the design basis
        </Button>
      </div>
    </form>
  );
}
