/**
 * Member sheet: one member's story, for the Plan page's side panel.
 *
 *   <MemberSheet
 *     member={schemeResult.members[i]}     // SchemeMember from designScheme (shared/engine): loads with
 *                                          // their `source`, bracing, reactions, tributary figures, design
 *     designBasis={plan.designBasis}       // PlanDesignBasis: method, Fy, deflection limits
 *     planMember={plan.members[j]}         // optional: the plan's record of the member (shape = locked
 *                                          // size, maxDepth_in, minDepth_in, allowedNominalDepths,
 *                                          // Lb_override_ft); without it the lock is read from design.locked
 *     units="US" | "SI"                    // display units (useUnits().system)
 *     canEdit={role may change sizes}      // false: no lock or constraint controls
 *     onLockShape={(shape) => …}           // "W21X48" to lock, null to unlock
 *     onConstraints={(c) => …}             // { maxDepth_in, minDepth_in, allowedNominalDepths }, inches,
 *                                          // null = no bound; validated (at least one catalog shape fits)
 *     onMemberSettings={(s) => …}          // optional: { bracing, Lb_override_ft, deflectionLimits } set on the
 *                                          // member (null = follow the framing / design basis)
 *     calcSheetHref="/api/…/calc-sheet.pdf" // optional: the one-member calc sheet download
 *     onClose={() => …}                    // Close button and the Escape key
 *     problems={['…']}                     // optional: scheme problems naming this member
 *   />
 *
 * Sections: summary; loads and where each came from; loading, shear, moment and deflected shape
 * (SVG from the engine's memberDiagrams stations, maxima labelled); unbraced segments with Lb and
 * Cb; every check with clause, equation, combination, demand, capacity and ratio, the governing
 * one marked, working on request; next lighter and next shallower shapes (memberAlternatives);
 * unfactored end reactions; size lock and depth constraints; the engineer's caution.
 * The caller re-designs the scheme after onLockShape / onConstraints and passes the new member.
 */
import { useEffect, useMemo, useRef, type ReactNode } from 'react';
import type { AlternativeShape, SchemeMember } from '../../../../shared/engine/index';
import type { PlanDesignBasis } from '../../../../shared/schemas/plan.schema';
import { Button } from '../../../components/ui/button.ui';
import { EngineerCaution } from '../../../components/ui/engineer-caution.ui';
import { UtilisationChip } from '../../../components/ui/utilisation-chip.ui';
import { formatQuantity, type UnitSystem } from '../../../lib/units';
import {
  attempt, bracePoints, sheetAlternatives, sheetDesignInput, sheetDiagrams, type MemberConstraints, type MemberPlanSettings,
} from '../lib/member-sheet.model';
import { MemberChecksTable, MemberSegmentsTable } from './member-checks.component';
import { MemberCompositeChoice, MemberCompositePanel } from './member-composite.component';
import { MemberDiagramsPanel } from './member-diagrams.component';
import { MemberLoadsTable, MemberReactionsTable } from './member-loads.component';
import type { PlanNamer } from '../../../../shared/drafting/element-names.drafting';
import { ConstraintsSummary, DepthConstraintsForm, ShapeLock } from './member-lock.component';
import { MemberSettingsPanel } from './member-settings.component';
import type { MemberBracingSettings } from '../lib/member-settings.model';

export interface MemberSheetProps {
  member: SchemeMember;
  designBasis: PlanDesignBasis;
  planMember?: Partial<MemberPlanSettings> | null;
  units: UnitSystem;
  canEdit: boolean;
  onLockShape: (shape: string | null) => void;
  onConstraints: (constraints: MemberConstraints) => void;
  /** Sets the member's bracing, Lb override and deflection limits (the caller re-designs). */
  onMemberSettings?: (settings: MemberBracingSettings) => void;
  /** Where the one-member calc sheet PDF downloads from (the saved revision's design). */
  calcSheetHref?: string;
  /** Whether the plan on screen is saved (the calc sheet is of the saved revision). */
  saved?: boolean;
  /** Composite on/off for this member (null follows the design basis); absent hides the control. */
  onComposite?: (composite: boolean | null) => void;
  onClose: () => void;
  problems?: string[];
  /** Names for the sheet's sentences (marks, grid locations, level and zone names), from the plan. */
  names?: PlanNamer;
}

const CHECK_WORDS: Record<string, string> = {
  flexure: 'flexure',
  shear: 'shear',
  deflectionLive: 'live-load deflection',
  deflectionTotal: 'total-load deflection',
};

function Section({ title, children, id }: { title: string; children: ReactNode; id: string }) {
  return (
    <section aria-labelledby={id} className="flex flex-col gap-2 border-t border-line pt-3">
      <h3 id={id} className="label-caps text-ink">
        {title}
      </h3>
      {children}
    </section>
  );
}

function AlternativeRow({ label, alt, units, empty }: { label: string; alt: AlternativeShape | null; units: UnitSystem; empty: string }) {
  return (
    <tr className="border-b border-line" data-alternative={label}>
      <th scope="row" className="py-1.5 pr-3 text-left font-normal text-ink-soft">
        {label}
      </th>
      {alt ? (
        <>
          <td className="py-1.5 pr-3 font-mono text-ink">{alt.shape}</td>
          <td className="figures py-1.5 pr-3 text-right font-mono">{formatQuantity('weight_plf', alt.weight_plf, units)}</td>
          <td className="figures py-1.5 pr-3 text-right font-mono">d {formatQuantity('length_in', alt.d_in, units)}</td>
          <td className="py-1.5 pr-3 text-right">
            <UtilisationChip ratio={alt.ratio} />
          </td>
          <td className="py-1.5 text-ink-soft">
            {alt.passes ? 'passes' : 'fails'}, {CHECK_WORDS[alt.governing]} governs
          </td>
        </>
      ) : (
        <td colSpan={5} className="py-1.5 text-ink-faint">
          {empty}
        </td>
      )}
    </tr>
  );
}

export function MemberSheet({
  member, designBasis, planMember, units, canEdit, onLockShape, onConstraints, onMemberSettings, calcSheetHref, saved = true, onComposite, onClose, problems = [], names,
}: MemberSheetProps) {
  const design = member.design;
  const idBase = `member-sheet-${member.id}`;

  // Stable settings so a parent re-render with equal values does not recompute the engine calls.
  const settingsKey = JSON.stringify({
    shape: planMember?.shape ?? null,
    maxDepth_in: planMember?.maxDepth_in ?? null,
    minDepth_in: planMember?.minDepth_in ?? null,
    allowedNominalDepths: planMember?.allowedNominalDepths ?? null,
    Lb_override_ft: planMember?.Lb_override_ft ?? null,
    bracing: planMember?.bracing ?? null,
    deflectionLimits: planMember?.deflectionLimits ?? null,
  });
  const settings = useMemo(() => JSON.parse(settingsKey) as MemberPlanSettings, [settingsKey]);
  const constraints: MemberConstraints = useMemo(
    () => ({ maxDepth_in: settings.maxDepth_in, minDepth_in: settings.minDepth_in, allowedNominalDepths: settings.allowedNominalDepths }),
    [settings],
  );
  const lockedShape = planMember ? settings.shape : design?.locked ? design.shape : null;
  const bracingSettings: MemberBracingSettings = useMemo(
    () => ({ bracing: settings.bracing ?? null, Lb_override_ft: settings.Lb_override_ft ?? null, deflectionLimits: settings.deflectionLimits ?? null }),
    [settings],
  );

  const input = useMemo(() => sheetDesignInput(member, designBasis, settings), [member, designBasis, settings]);
  const diagrams = useMemo(() => (design ? attempt(() => sheetDiagrams(input, design.shape)) : null), [input, design]);
  const alternatives = useMemo(() => (design ? attempt(() => sheetAlternatives(input, design.shape)) : null), [input, design]);

  const flexure = design?.checks.find((c) => c.name === 'flexure');
  const governingSegment = design && flexure ? design.segments.findIndex((s) => s.from_ft === flexure.from_ft && s.to_ft === flexure.to_ft) : -1;
  const braces = bracePoints(member);

  const rootRef = useRef<HTMLElement>(null);
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape' && rootRef.current?.contains(document.activeElement)) onClose();
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  }, [onClose]);

  return (
    <aside ref={rootRef} aria-label={`Member sheet ${member.mark || member.id}`} className="flex flex-col gap-4 bg-paper-raised p-4 text-ink">
      <header className="flex items-start justify-between gap-3 border-b-2 border-ink pb-3">
        <div className="min-w-0">
          <p className="label-caps">
            {member.kind === 'girder' ? 'Girder' : 'Beam'} · {names?.level(member.level) ?? member.level}
            {names?.member(member.id)?.includes(' at ') ? ` · ${names.member(member.id)!.slice(names.member(member.id)!.indexOf(' at ') + 1)}` : ''}
          </p>
          <h2 className="flex flex-wrap items-baseline gap-x-3 text-xl font-semibold tracking-tight">
            <span className="font-mono">{member.mark || member.id}</span>
            <span className="font-mono" data-testid="member-sheet-shape">{design?.shape ?? member.shape ?? 'not sized'}</span>
            {lockedShape ? <span className="label-caps text-accent-strong">locked</span> : null}
          </h2>
          <p className="figures mt-1 text-sm text-ink-soft">
            Span {formatQuantity('length_ft', member.span_ft, units)}
            {design ? (
              <>
                {' '}· {formatQuantity('weight_plf', design.weight_plf, units)} · {design.method}, Fy {formatQuantity('stress_ksi', design.Fy_ksi, units)}
              </>
            ) : null}
          </p>
        </div>
        <div className="flex shrink-0 items-center gap-2">
          <span data-testid="member-sheet-ratio">{design ? <UtilisationChip ratio={design.ratio} /> : <UtilisationChip ratio={Number.NaN} />}</span>
          <Button variant="quiet" onClick={onClose} aria-label="Close member sheet">
            Close
          </Button>
        </div>
      </header>

      {design ? (
        <p className={`text-sm ${design.passes ? 'text-ink-soft' : 'text-danger'}`} role={design.passes ? undefined : 'alert'}>
          {design.passes ? (
            <>
              Passes every check. Governing: {CHECK_WORDS[design.governing]}, {design.checks.find((c) => c.name === design.governing)?.clause}.
            </>
          ) : (
            (design.failure ?? 'Does not pass.')
          )}
        </p>
      ) : (
        <p role="alert" className="text-sm text-danger">
          This member could not be designed.
        </p>
      )}
      {problems.length ? (
        <ul className="m-0 list-disc pl-5 text-sm text-danger">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}

      <Section title="Loads and where they come from" id={`${idBase}-loads`}>
        <MemberLoadsTable member={member} units={units} names={names} />
      </Section>

      {design && diagrams ? (
        <Section title="Diagrams" id={`${idBase}-diagrams`}>
          {diagrams.value ? (
            <MemberDiagramsPanel
              diagrams={diagrams.value}
              loads={member.loads}
              span_ft={member.span_ft}
              brace={member.bracing === 'continuous' ? 'continuous' : braces}
              units={units}
              deflectionTotal_in={Math.max(design.deflectionTotal_in, ...diagrams.value.deflectionTotal_in)}
            />
          ) : (
            <p className="text-sm text-danger">Diagrams unavailable: {diagrams.error}</p>
          )}
        </Section>
      ) : null}

      {design ? (
        <>
          <Section title="Unbraced segments" id={`${idBase}-segments`}>
            <MemberSegmentsTable segments={design.segments} governingIndex={governingSegment} units={units} method={design.method} />
            <p className="text-xs text-ink-faint">
              L<sub>b</sub> between brace points (framing members and deck); C<sub>b</sub> by AISC 360-16 Eq. F1-1 from the moment
              diagram of each combination, 1.0 where bracing is continuous or L<sub>b</sub> is overridden.
            </p>
          </Section>

          <Section title="Composite section" id={`${idBase}-composite`}>
            <MemberCompositeChoice value={planMember?.composite ?? null} basisComposite={designBasis.composite?.enabled ?? false} canEdit={canEdit && !!onComposite} onChange={(v) => onComposite?.(v)} />
            <MemberCompositePanel design={design} note={member?.compositeNote ?? null} />
          </Section>

          <Section title="Checks" id={`${idBase}-checks`}>
            <MemberChecksTable design={design} units={units} />
          </Section>

          <Section title="Lighter and shallower" id={`${idBase}-alternatives`}>
            {alternatives?.value ? (
              <table className="w-full border-collapse text-sm">
                <caption className="sr-only">Next lighter and next shallower shapes</caption>
                <tbody>
                  <AlternativeRow label="Next lighter" alt={alternatives.value.nextLighter} units={units} empty="No lighter shape within the constraints." />
                  <AlternativeRow label="Next shallower" alt={alternatives.value.nextShallower} units={units} empty="No shallower shape passes within the constraints." />
                  {alternatives.value.sameWeight ? <AlternativeRow label="Same weight" alt={alternatives.value.sameWeight} units={units} empty="" /> : null}
                </tbody>
              </table>
            ) : (
              <p className="text-sm text-ink-faint">{alternatives?.error ?? 'Not available.'}</p>
            )}
          </Section>
        </>
      ) : null}

      <Section title="End reactions" id={`${idBase}-reactions`}>
        <MemberReactionsTable design={design} member={member} units={units} />
      </Section>

      <Section title="Bracing and deflection limits" id={`${idBase}-bracing`}>
        <MemberSettingsPanel
          member={member}
          design={design}
          designBasis={designBasis}
          settings={bracingSettings}
          units={units}
          canEdit={canEdit && !!onMemberSettings}
          onSettings={(s) => onMemberSettings?.(s)}
        />
      </Section>

      <Section title="Size and constraints" id={`${idBase}-size`}>
        {canEdit ? (
          <>
            <ShapeLock input={input} lockedShape={lockedShape} designedShape={design?.shape ?? null} units={units} onLockShape={onLockShape} />
            <DepthConstraintsForm value={constraints} units={units} onConstraints={onConstraints} />
          </>
        ) : (
          <ConstraintsSummary value={constraints} lockedShape={lockedShape} units={units} />
        )}
      </Section>

      {calcSheetHref ? (
        <Section title="Calc sheet" id={`${idBase}-calc-sheet`}>
          <p className="text-sm text-ink-soft">
            <a className="text-accent underline" href={calcSheetHref} download data-testid="member-calc-sheet-link">
              Download this member’s calc sheet (PDF)
            </a>{' '}
            — loads, Mu and Vu, every check with its clause, deflection{design?.composite ? ', both composite stages' : ''}, title block and caution.
            {saved ? '' : ' Your latest change is still saving; the sheet is of the last saved revision.'}
          </p>
        </Section>
      ) : null}

      <footer className="border-t border-line pt-3">
        <EngineerCaution />
      </footer>
    </aside>
  );
}
