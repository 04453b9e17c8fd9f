/**
 * Design basis form: the project-wide settings every member is designed to.
 *
 *   <DesignBasisForm
 *     value={plan.designBasis}            // PlanDesignBasis (shared/schemas/plan.schema.ts)
 *     onSubmit={async (next) => { ... }}  // receives a complete, valid PlanDesignBasis;
 *                                         // may return a promise; a thrown ApiError's field
 *                                         // errors land beside the fields, others above the form
 *     canEdit={role may write}            // false: read-only, no Save button
 *     units="US" | "SI"                   // optional; default: the reader's stored choice (useUnits)
 *   />
 *
 * Fields: method (LRFD | ASD), Fy in ksi (36–70; 50 for ASTM A992, common practice; the SI
 * equivalent in MPa is shown beside it, the value stays in ksi as steel grades are specified),
 * deflection limits as the denominators n of span/n (live, total; IBC Table 1604.3 floor
 * defaults 360 and 240; blank skips a check), live load reduction (ASCE 7-16 §4.7) on or off,
 * and what the total deflection includes. Composite beams (design-basis §6, §6a): on or off for
 * members under a slab, stud diameter and Fu, the minimum percent composite, the steel weight a
 * stud counts as in selection, the construction live load, shored construction and camber.
 * Settings the form does not show (columns) are kept. The caller re-designs the scheme after onSubmit.
 */
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useId } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import type { PlanDesignBasis } from '../../../../shared/schemas/plan.schema';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { applyServerErrors } from '../../../lib/form-errors';
import { formatQuantity, type UnitSystem } from '../../../lib/units';
import { useUnits } from '../../../lib/units-context';
import {
  designBasisFormSchema, FY_DEFAULT_KSI, FY_MAX_KSI, FY_MIN_KSI, IBC_DEFLECTION_DEFAULTS, MIN_COMPOSITE_PCT_RANGE, mergeDesignBasis,
  STUD_EQUIVALENT_WEIGHT_DEFAULT_LB, STUD_FU_RANGE_KSI, toFormValues,
  type DesignBasisFormValues,
} from './design-basis-form.schema';

export interface DesignBasisFormProps {
  value: PlanDesignBasis;
  onSubmit: (next: PlanDesignBasis) => unknown | Promise<unknown>;
  canEdit: boolean;
  units?: UnitSystem;
}

const FIELDS = [
  'method', 'Fy_ksi', 'liveLimit', 'totalLimit', 'liveLoadReduction', 'totalDeflectionIncludes', 'compositeEnabled', 'studDiameter_in',
  'studFu_ksi', 'minPercentComposite', 'studEquivalentWeight_lb', 'constructionLive_psf', 'shored', 'camber',
] as const;

export function DesignBasisForm({ value, onSubmit, canEdit, units }: DesignBasisFormProps) {
  const stored = useUnits().system;
  const system = units ?? stored;
  const ids = useId();
  const {
    register,
    handleSubmit,
    reset,
    setValue,
    setError,
    control,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<DesignBasisFormValues, unknown, PlanDesignBasis>({
    resolver: zodResolver(designBasisFormSchema),
    defaultValues: toFormValues(value),
  });

  // A saved or reloaded basis replaces what is shown, unless the reader is mid-edit.
  const valueKey = JSON.stringify(value);
  useEffect(() => {
    if (!isDirty) reset(toFormValues(JSON.parse(valueKey) as PlanDesignBasis));
  }, [valueKey]);

  const fyText = useWatch({ control, name: 'Fy_ksi' });
  const fy = Number(fyText);
  const fyHint =
    Number.isFinite(fy) && fy > 0 && system === 'SI'
      ? `= ${formatQuantity('stress_ksi', fy, 'SI')}. ${FY_DEFAULT_KSI} ksi for ASTM A992 (common practice).`
      : `${FY_DEFAULT_KSI} ksi for ASTM A992 (common practice); ${FY_MIN_KSI}–${FY_MAX_KSI} ksi accepted.`;

  const compositeOn = useWatch({ control, name: 'compositeEnabled' });

  const submit = handleSubmit(async (formBasis) => {
    const next = mergeDesignBasis(value, formBasis);
    try {
      await onSubmit(next);
      reset(toFormValues(next));
    } catch (error) {
      applyServerErrors(error, setError, FIELDS);
    }
  });

  const readOnly = !canEdit;
  const radio = 'size-4 accent-[var(--color-accent)]';

  return (
    <form onSubmit={submit} noValidate aria-label="Design basis" className="flex flex-col gap-5">
      <FormAlert>{errors.root?.server?.message}</FormAlert>

      <fieldset className="flex flex-col gap-2" disabled={readOnly}>
        <legend className="mb-1 text-sm font-medium text-ink">Design method</legend>
        <div className="flex flex-wrap gap-4 text-sm">
          <label className="inline-flex items-center gap-2">
            <input type="radio" value="LRFD" className={radio} {...register('method')} />
            LRFD <span className="text-ink-faint">(ASCE 7-16 §2.3 strength combinations, φ factors)</span>
          </label>
          <label className="inline-flex items-center gap-2">
            <input type="radio" value="ASD" className={radio} {...register('method')} />
            ASD <span className="text-ink-faint">(ASCE 7-16 §2.4 combinations, Ω factors)</span>
          </label>
        </div>
        {errors.method ? <p className="text-sm text-danger">{errors.method.message}</p> : null}
      </fieldset>

      <div className="grid gap-4 sm:grid-cols-[12rem_1fr]">
        <TextField
          label="Fy (ksi)"
          inputMode="decimal"
          className="figures font-mono"
          readOnly={readOnly}
          error={errors.Fy_ksi?.message}
          hint={fyHint}
          {...register('Fy_ksi')}
        />
      </div>

      <fieldset className="flex flex-col gap-3" disabled={readOnly}>
        <legend className="mb-1 text-sm font-medium text-ink">Deflection limits (span / n)</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            label="Live load, n"
            inputMode="numeric"
            className="figures font-mono"
            readOnly={readOnly}
            optional
            error={errors.liveLimit?.message}
            hint={`IBC Table 1604.3 floors: ${IBC_DEFLECTION_DEFAULTS.live}. Blank skips the check.`}
            {...register('liveLimit')}
          />
          <TextField
            label="Total load, n"
            inputMode="numeric"
            className="figures font-mono"
            readOnly={readOnly}
            optional
            error={errors.totalLimit?.message}
            hint={`IBC Table 1604.3 floors: ${IBC_DEFLECTION_DEFAULTS.total}. Blank skips the check.`}
            {...register('totalLimit')}
          />
        </div>
        {readOnly ? null : (
          <div>
            <Button
              variant="quiet"
              onClick={() => {
                setValue('liveLimit', String(IBC_DEFLECTION_DEFAULTS.live), { shouldDirty: true, shouldValidate: true });
                setValue('totalLimit', String(IBC_DEFLECTION_DEFAULTS.total), { shouldDirty: true, shouldValidate: true });
              }}
            >
              Use IBC floor limits (L/{IBC_DEFLECTION_DEFAULTS.live}, L/{IBC_DEFLECTION_DEFAULTS.total})
            </Button>
          </div>
        )}
        <div className="flex flex-col gap-1.5 text-sm">
          <span id={`${ids}-total`} className="font-medium text-ink">
            Total deflection includes
          </span>
          <div role="radiogroup" aria-labelledby={`${ids}-total`} className="flex flex-wrap gap-4">
            <label className="inline-flex items-center gap-2">
              <input type="radio" value="deadAndLive" className={radio} {...register('totalDeflectionIncludes')} />
              All dead + live
            </label>
            <label className="inline-flex items-center gap-2">
              <input type="radio" value="superimposedDeadAndLive" className={radio} {...register('totalDeflectionIncludes')} />
              Superimposed dead + live (cambered or composite beams)
            </label>
          </div>
          <p className="text-xs text-ink-faint">
            Recorded for the calculation report. Member checks currently take total deflection under all loads together,
            the conservative reading, whichever is chosen.
          </p>
        </div>
      </fieldset>

      <fieldset disabled={readOnly}>
        <legend className="sr-only">Live load reduction</legend>
        <label className="inline-flex items-start gap-2 text-sm">
          <input type="checkbox" className="mt-0.5 size-4 accent-[var(--color-accent)]" {...register('liveLoadReduction')} />
          <span>
            <span className="font-medium text-ink">Reduce live loads</span>
            <span className="block text-xs text-ink-faint">
              ASCE 7-16 §4.7 (Eq. 4.7-1) where K<sub>LL</sub>A<sub>T</sub> ≥ 400 ft²; never for live loads over 100 psf or
              assembly occupancies.
            </span>
          </span>
        </label>
      </fieldset>

      <fieldset className="flex flex-col gap-3" disabled={readOnly} aria-describedby={`${ids}-composite-note`}>
        <legend className="mb-1 text-sm font-medium text-ink">Composite beams (AISC 360-16 Chapter I)</legend>
        <label className="inline-flex items-start gap-2 text-sm">
          <input type="checkbox" className="mt-0.5 size-4 accent-[var(--color-accent)]" {...register('compositeEnabled')} />
          <span>
            <span className="font-medium text-ink">Design beams and girders under a slab composite</span>
            <span className="block text-xs text-ink-faint">
              Members under a deck with a slab build-up get studs; a member set to bare steel on its Member sheet stays bare steel.
            </span>
          </span>
        </label>
        <div className="grid gap-4 sm:grid-cols-2">
          <div className="flex flex-col gap-1 text-sm">
            <label htmlFor={`${ids}-stud-d`} className="font-medium text-ink">
              Stud diameter
            </label>
            <select id={`${ids}-stud-d`} aria-describedby={`${ids}-stud-d-hint`} className="h-9 rounded-[3px] border border-line bg-paper-raised px-2 text-sm" {...register('studDiameter_in')}>
              <option value="0.5">1/2 in</option>
              <option value="0.625">5/8 in</option>
              <option value="0.75">3/4 in</option>
            </select>
            <span id={`${ids}-stud-d-hint`} className="text-xs text-ink-faint">At most 3/4 in through formed deck (AISC 360-16 I3.2c).</span>
          </div>
          <TextField
            label="Stud Fu (ksi)"
            inputMode="decimal"
            className="figures font-mono"
            readOnly={readOnly}
            error={errors.studFu_ksi?.message}
            hint={`65 ksi for Type B headed studs (AWS D1.1); ${STUD_FU_RANGE_KSI.min}–${STUD_FU_RANGE_KSI.max} ksi accepted. Used in Eq. I8-1.`}
            {...register('studFu_ksi')}
          />
          <TextField
            label="Minimum composite (%)"
            inputMode="decimal"
            className="figures font-mono"
            readOnly={readOnly}
            error={errors.minPercentComposite?.message}
            hint={`ΣQn at least this share of full composite; ${MIN_COMPOSITE_PCT_RANGE.min} % is the common-practice minimum.`}
            {...register('minPercentComposite')}
          />
          <TextField
            label="Steel-equivalent weight of a stud (lb)"
            inputMode="decimal"
            className="figures font-mono"
            readOnly={readOnly}
            error={errors.studEquivalentWeight_lb?.message}
            hint={`Selection weighs each stud as this much steel (about ${STUD_EQUIVALENT_WEIGHT_DEFAULT_LB} lb, common practice).`}
            {...register('studEquivalentWeight_lb')}
          />
          <TextField
            label="Construction live load (psf)"
            inputMode="decimal"
            className="figures font-mono"
            readOnly={readOnly}
            error={errors.constructionLive_psf?.message}
            hint="On the bare steel with the wet concrete (about 20 psf, common practice)."
            {...register('constructionLive_psf')}
          />
        </div>
        <div className="flex flex-wrap gap-6 text-sm">
          <label className="inline-flex items-center gap-2">
            <input type="checkbox" className="size-4 accent-[var(--color-accent)]" {...register('shored')} />
            Shored construction (all loads on the composite section, no camber)
          </label>
          <label className="inline-flex items-center gap-2">
            <input type="checkbox" className="size-4 accent-[var(--color-accent)]" {...register('camber')} />
            Camber unshored members
          </label>
        </div>
        <p id={`${ids}-composite-note`} className="text-xs text-ink-faint">
          {compositeOn
            ? 'Camber about 80 % of the wet-concrete deflection, rounded down to 1/4 in, none below 3/4 in (common practice).'
            : 'Composite design is off: every member is sized as bare steel unless its Member sheet says composite.'}
        </p>
      </fieldset>

      {readOnly ? (
        <p className="text-xs text-ink-soft">Your role can read the design basis but not change it.</p>
      ) : (
        <div className="flex items-center gap-2 border-t border-line pt-4">
          <Button type="submit" pending={isSubmitting} disabled={!isDirty}>
            Save design basis
          </Button>
          <Button variant="quiet" disabled={!isDirty || isSubmitting} onClick={() => reset(toFormValues(value))}>
            Discard changes
          </Button>
        </div>
      )}
    </form>
  );
}
