import { useState } from 'react';
import { buttonClasses } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { planSheetPdfHref, usePlanSheet } from '../api/get-plan-sheet.api';
import { SheetSvg } from './sheet-svg.component';

/** On-screen review of a scheme's framing plan sheet, one level at a time. */
export function PlanSheetViewer({ schemeId, levels }: { schemeId: string; levels: { id: string; name: string }[] }) {
  const [levelId, setLevelId] = useState(levels[0]?.id ?? '');
  const [reactions, setReactions] = useState(false);
  const sheet = usePlanSheet(schemeId, levelId, reactions);
  return (
    <section aria-labelledby="plan-sheet-heading" className="flex flex-col gap-3 border-2 border-ink bg-paper-raised p-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h3 id="plan-sheet-heading" className="text-lg font-semibold">
          Plan sheet
        </h3>
        <div className="flex flex-wrap items-end gap-3 text-sm">
          <label className="flex flex-col gap-1">
            <span className="label-caps">Level</span>
            <select className="h-9 rounded-[3px] border border-ink/60 bg-paper px-2" value={levelId} onChange={(e) => setLevelId(e.target.value)}>
              {levels.map((l) => (
                <option key={l.id} value={l.id}>
                  {l.name}
                </option>
              ))}
            </select>
          </label>
          <label className="flex h-9 items-center gap-2">
            <input type="checkbox" checked={reactions} onChange={(e) => setReactions(e.target.checked)} />
            End reactions
          </label>
          <a className={buttonClasses('secondary')} href={planSheetPdfHref(schemeId, levelId, reactions)} download>
            This level as PDF
          </a>
        </div>
      </div>
      {sheet.isPending ? (
        <Loading label="Drawing the sheet…" />
      ) : sheet.isError ? (
        <FormAlert>The plan sheet could not be drawn: {sheet.error.message}</FormAlert>
      ) : sheet.data.sheets[0] ? (
        <div className="overflow-auto border border-line bg-paper-sunk p-2">
          <SheetSvg sheet={sheet.data.sheets[0]} title={`Framing plan, ${sheet.data.sheets[0].levelName}`} />
        </div>
      ) : null}
    </section>
  );
}
