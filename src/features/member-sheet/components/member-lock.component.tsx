// Locking a member's size and setting its depth constraints, with a preview of the shape's
// ratio before it is locked. Rendered only for roles that may change sizes.
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useId, useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { findWShape, listWShapes, nominalDepthIn } from '../../../../shared/catalog/w-shapes.catalog';
import type { MemberDesignInput } from '../../../../shared/engine/index';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { UtilisationChip } from '../../../components/ui/utilisation-chip.ui';
import { formatQuantity, unitLabel, type UnitSystem } from '../../../lib/units';
import { constraintsSchema, toConstraintsForm, type ConstraintsFormValues } from '../lib/member-constraints.schema';
import { attempt, previewShape, type MemberConstraints } from '../lib/member-sheet.model';

/** Catalog shapes grouped by nominal depth (shallow first), lightest first in each group. */
const SHAPE_GROUPS: { depth: number; shapes: string[] }[] = (() => {
  const groups = new Map<number, { label: string; w: number }[]>();
  for (const s of listWShapes()) {
    const d = nominalDepthIn(s);
    const list = groups.get(d) ?? [];
    list.push({ label: s.label, w: s.W_plf });
    groups.set(d, list);
  }
  return [...groups.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([depth, list]) => ({ depth, shapes: list.sort((a, b) => a.w - b.w).map((x) => x.label) }));
})();

const CHECK_WORDS: Record<string, string> = {
  flexure: 'flexure',
  shear: 'shear',
  deflectionLive: 'live-load deflection',
  deflectionTotal: 'total-load deflection',
};

type LockProps = {
  input: MemberDesignInput | null;
  lockedShape: string | null;
  designedShape: string | null;
  units: UnitSystem;
  onLockShape: (shape: string | null) => void;
};

export function ShapeLock({ input, lockedShape, designedShape, units, onLockShape }: LockProps) {
  const id = useId();
  const [choice, setChoice] = useState<string>(lockedShape ?? designedShape ?? '');
  const [error, setError] = useState<string | null>(null);
  useEffect(() => setChoice(lockedShape ?? designedShape ?? ''), [lockedShape, designedShape]);

  const preview = useMemo(() => {
    if (!input || !choice || !findWShape(choice)) return null;
    return attempt(() => previewShape(input, choice));
  }, [input, choice]);

  const lock = () => {
    if (!choice) return setError('Choose a shape to lock');
    const shape = findWShape(choice);
    if (!shape) return setError(`${choice} is not in the AISC Shapes Database v15.0`);
    setError(null);
    onLockShape(shape.label);
  };

  return (
    <div className="flex flex-col gap-2">
      <p className="text-sm text-ink-soft">
        {lockedShape ? (
          <>
            Size locked at <strong className="font-mono text-ink">{lockedShape}</strong>: it is checked as is and never replaced.
          </>
        ) : (
          'Size chosen by Baywright: the lightest shape that passes every check within the constraints.'
        )}
      </p>
      <div className="flex flex-wrap items-end gap-2">
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${id}-shape`} className="text-sm font-medium text-ink">
            Shape to lock
          </label>
          <select
            id={`${id}-shape`}
            value={choice}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-error` : preview ? `${id}-preview` : undefined}
            onChange={(e) => {
              setChoice(e.target.value);
              setError(null);
            }}
            className={`figures h-10 rounded-[3px] border bg-paper-raised px-2 font-mono text-sm ${error ? 'border-danger' : 'border-line'}`}
          >
            <option value="">Choose a W-shape…</option>
            {SHAPE_GROUPS.map((g) => (
              <optgroup key={g.depth} label={`W${g.depth}`}>
                {g.shapes.map((s) => (
                  <option key={s} value={s}>
                    {s}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </div>
        <Button onClick={lock}>{lockedShape ? 'Lock this size instead' : 'Lock size'}</Button>
        {lockedShape ? (
          <Button variant="secondary" onClick={() => onLockShape(null)}>
            Unlock
          </Button>
        ) : null}
      </div>
      {error ? (
        <p id={`${id}-error`} className="text-sm text-danger">
          {error}
        </p>
      ) : preview ? (
        <p id={`${id}-preview`} className="flex flex-wrap items-center gap-2 text-sm text-ink-soft">
          {preview.value ? (
            <>
              <span>If locked,</span>
              <span className="font-mono text-ink">{preview.value.shape}</span>
              <span>works at</span>
              <UtilisationChip ratio={preview.value.ratio} />
              <span>
                governed by {CHECK_WORDS[preview.value.governing]}
                {preview.value.passes ? '' : '; it fails, and a locked size that fails is reported as failing'}.
              </span>
              <span className="figures font-mono">{formatQuantity('weight_plf', preview.value.weight_plf, units)}</span>
            </>
          ) : (
            <span className="text-danger">{preview.error}</span>
          )}
        </p>
      ) : null}
    </div>
  );
}

type ConstraintsProps = {
  value: MemberConstraints;
  units: UnitSystem;
  onConstraints: (c: MemberConstraints) => void;
};

export function DepthConstraintsForm({ value, units, onConstraints }: ConstraintsProps) {
  const schema = useMemo(() => constraintsSchema(units, value), [units, value]);
  const {
    register,
    handleSubmit,
    reset,
    formState: { errors, isDirty },
  } = useForm<ConstraintsFormValues, unknown, MemberConstraints>({
    resolver: zodResolver(schema),
    defaultValues: toConstraintsForm(value, units),
  });
  const key = `${units}|${JSON.stringify(value)}`;
  useEffect(() => {
    reset(toConstraintsForm(value, units));
  }, [key]); // value and units are captured in key

  const depthUnit = unitLabel('length_in', units);
  return (
    <form aria-label="Depth constraints" noValidate onSubmit={handleSubmit((c) => onConstraints(c))} className="flex flex-col gap-3">
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField label={`Maximum depth d (${depthUnit})`} optional inputMode="decimal" className="figures font-mono" error={errors.maxDepth?.message} {...register('maxDepth')} />
        <TextField label={`Minimum depth d (${depthUnit})`} optional inputMode="decimal" className="figures font-mono" error={errors.minDepth?.message} {...register('minDepth')} />
        <TextField
          label="Nominal depths allowed"
          optional
          className="figures font-mono"
          placeholder="e.g. 16, 18, 21"
          error={errors.nominalDepths?.message}
          hint="Designation depths (W16, W18 …), comma separated; blank allows all."
          {...register('nominalDepths')}
        />
      </div>
      <div className="flex gap-2">
        <Button type="submit" variant="secondary" disabled={!isDirty}>
          Apply constraints
        </Button>
        <Button
          variant="quiet"
          onClick={() => {
            reset({ maxDepth: '', minDepth: '', nominalDepths: '' });
            onConstraints({ maxDepth_in: null, minDepth_in: null, allowedNominalDepths: null });
          }}
          disabled={value.maxDepth_in == null && value.minDepth_in == null && !value.allowedNominalDepths?.length}
        >
          Clear constraints
        </Button>
      </div>
    </form>
  );
}

/** What a read-only reader sees instead of the controls. */
export function ConstraintsSummary({ value, lockedShape, units }: { value: MemberConstraints; lockedShape: string | null; units: UnitSystem }) {
  const parts: string[] = [];
  if (value.maxDepth_in != null) parts.push(`d ≤ ${formatQuantity('length_in', value.maxDepth_in, units)}`);
  if (value.minDepth_in != null) parts.push(`d ≥ ${formatQuantity('length_in', value.minDepth_in, units)}`);
  if (value.allowedNominalDepths?.length) parts.push(`nominal depths ${value.allowedNominalDepths.map((d) => `W${d}`).join(', ')}`);
  return (
    <p className="text-sm text-ink-soft">
      {lockedShape ? (
        <>
          Size locked at <strong className="font-mono text-ink">{lockedShape}</strong>.{' '}
        </>
      ) : (
        'Size chosen by Baywright. '
      )}
      {parts.length ? `Constraints: ${parts.join('; ')}.` : 'No depth constraints.'}
    </p>
  );
}
