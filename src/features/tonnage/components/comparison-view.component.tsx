import { useMemo, useState, type ReactNode } from 'react';
import { describeDifference, formatEstimateUsd, tonnageDifference } from '../../../../shared/tonnage/cost';
import { buttonClasses } from '../../../components/ui/button.ui';
import { EmptyState } from '../../../components/ui/empty-state.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { comparisonPath, type Comparison, type ComparisonScheme } from '../api/get-comparison.api';
import { SCHEME_COLOURS, TonnageCharts } from './tonnage-charts.component';
import { describeDifferenceSi, KG_PER_SHORT_TON, tonnageUnits } from './tonnage-units';
import { useUnits } from '../../../lib/units-context';

export const MAX_COMPARED = 4;

const int = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const one = new Intl.NumberFormat('en-US', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
const two = new Intl.NumberFormat('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const signed = (n: number, fmt: Intl.NumberFormat) => `${n > 0 ? '+' : n < 0 ? '−' : '±'}${fmt.format(Math.abs(n))}`;
const signedUsd = (n: number) => `${n > 0 ? '+' : n < 0 ? '−' : '±'}${formatEstimateUsd(Math.abs(n))}`;

/** Default selection: the chosen scheme first, then the others in order, up to four. */
export function defaultSelection(schemes: ComparisonScheme[]): string[] {
  const chosen = schemes.filter((s) => s.status === 'chosen');
  const rest = schemes.filter((s) => s.status !== 'chosen');
  return [...chosen, ...rest].slice(0, MAX_COMPARED).map((s) => s.id);
}

/** The scheme the others are measured against: the chosen one, else the first shown. */
export function baseScheme(schemes: ComparisonScheme[]): ComparisonScheme | undefined {
  const designed = schemes.filter((s) => s.totals);
  return designed.find((s) => s.status === 'chosen') ?? designed[0];
}

function Figure({ label, children, strong = false }: { label: string; children: ReactNode; strong?: boolean }) {
  return (
    <>
      <dt className="text-ink-soft">{label}</dt>
      <dd className={`figures text-right font-mono ${strong ? 'text-base font-semibold text-ink' : 'text-ink'}`}>{children}</dd>
    </>
  );
}

const STATUS_TEXT = { draft: 'Draft', in_review: 'In review', chosen: 'Chosen' } as const;

function StatusTag({ status }: { status: ComparisonScheme['status'] }) {
  const tone =
    status === 'chosen' ? 'border-accent bg-accent text-white' : status === 'in_review' ? 'border-notice bg-notice-wash text-notice' : 'border-ink/40 text-ink-soft';
  return (
    <span data-testid="scheme-status" className={`rounded-[2px] border px-1.5 text-[0.6875rem] font-semibold uppercase tracking-wide ${tone}`}>
      {status === 'chosen' ? '✓ ' : ''}
      {STATUS_TEXT[status]}
    </span>
  );
}

function SchemeCard({
  scheme,
  colour,
  marks,
  actions,
}: {
  scheme: ComparisonScheme;
  colour: string;
  marks: string[];
  actions?: ReactNode;
}) {
  const t = scheme.totals;
  const { system } = useUnits();
  const u = tonnageUnits(system);
  return (
    <article aria-label={scheme.name} className="flex flex-col border-2 border-ink bg-paper-raised">
      <header className="flex items-start gap-2 border-b border-ink px-3 py-2">
        <span aria-hidden className="mt-1.5 size-3 shrink-0" style={{ background: colour }} />
        <div className="min-w-0 flex-1">
          <h3 className="text-sm leading-snug font-semibold text-ink">{scheme.name}</h3>
          <div className="mt-1 flex flex-wrap items-center gap-1.5">
            <StatusTag status={scheme.status} />
            {marks.map((m) => (
              <span key={m} className="label-caps rounded-[2px] border border-ink/40 px-1 !text-[0.625rem]">
                {m}
              </span>
            ))}
          </div>
        </div>
      </header>
      {t ? (
        <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 px-3 py-3 text-sm">
          <Figure label="Steel weight" strong>
            {one.format(u.big(t.steelWeight_lb))} {u.bigUnit}
          </Figure>
          <Figure label="">
            {int.format(u.small(t.steelWeight_lb))} {u.smallUnit}
          </Figure>
          <Figure label="Steel per floor area">{t.steel_psf === null ? '—' : `${u.perAreaFmt.format(u.perArea(t.steel_psf))} ${u.perAreaUnit}`}</Figure>
          <Figure label="Floor area">
            {int.format(u.area(t.floorArea_ft2))} {u.areaUnit}
          </Figure>
          <Figure label="Pieces">{int.format(t.pieces)}</Figure>
          <Figure label="Connections">{int.format(t.connections)}</Figure>
          <Figure label="Shear studs">{int.format(t.studs)}</Figure>
          <Figure label="Cambered pieces">{int.format(t.camberedPieces)}</Figure>
          {t.cost_usd !== null ? (
            <>
              <Figure label="Steel cost">{t.steel_usd === null ? '—' : formatEstimateUsd(t.steel_usd)}</Figure>
              <Figure label="Connections cost">{t.connections_usd === null ? '—' : formatEstimateUsd(t.connections_usd)}</Figure>
              <Figure label="Shear studs cost">{t.studs_usd === null ? 'not priced' : formatEstimateUsd(t.studs_usd)}</Figure>
              <Figure label="Camber cost">{t.camber_usd === null ? 'not priced' : formatEstimateUsd(t.camber_usd)}</Figure>
            </>
          ) : null}
          <Figure label="Estimated cost" strong>
            {t.cost_usd === null ? 'not priced' : formatEstimateUsd(t.cost_usd)}
          </Figure>
        </dl>
      ) : (
        <div className="px-3 py-3">
          <FormAlert>This scheme could not be designed: {scheme.designError}</FormAlert>
        </div>
      )}
      <div className="mt-auto flex flex-col gap-2 border-t border-line px-3 py-2 text-xs text-ink-soft">
        {scheme.revision !== undefined && scheme.designedAt ? (
          <span>
            Designed from revision {scheme.revision}, {new Date(scheme.designedAt).toLocaleString('en-US', { dateStyle: 'medium', timeStyle: 'short' })}
          </span>
        ) : null}
        {scheme.failingMembers ? (
          <span className="text-danger">
            {scheme.failingMembers} member{scheme.failingMembers === 1 ? '' : 's'} fail a check: weights are not final.
          </span>
        ) : null}
        {t && t.unsizedPieces > 0 ? <span className="text-danger">{t.unsizedPieces} pieces have no size yet.</span> : null}
        {actions}
      </div>
    </article>
  );
}

function Differences({ base, others }: { base: ComparisonScheme; others: ComparisonScheme[] }) {
  const rows = others.filter((s) => s.totals).map((s) => ({ s, d: tonnageDifference(base.totals!, s.totals!) }));
  const { system } = useUnits();
  const u = tonnageUnits(system);
  if (rows.length === 0) return null;
  return (
    <section aria-labelledby="differences-heading" className="border border-ink/80 bg-paper-raised">
      <h3 id="differences-heading" className="label-caps border-b border-ink/80 px-4 py-2 text-ink">
        Against {base.name}
        {base.status === 'chosen' ? ' (chosen)' : ''}
      </h3>
      <ul className="flex flex-col gap-1 px-4 py-3 text-sm" data-testid="difference-sentences">
        {rows.map(({ s, d }) => (
          <li key={s.id} className="font-medium text-ink">
            {system === 'SI' ? describeDifferenceSi(s.name, base.name, d) : describeDifference(s.name, base.name, d)}
          </li>
        ))}
      </ul>
      <div className="overflow-x-auto border-t border-line">
        <table className="w-full text-sm">
          <thead>
            <tr className="border-b border-ink/60 text-right">
              <th className="label-caps px-4 py-2 text-left">Scheme</th>
              <th className="label-caps px-3 py-2">{u.smallUnit}</th>
              <th className="label-caps px-3 py-2">{u.bigUnit}</th>
              <th className="label-caps px-3 py-2">{u.perAreaUnit}</th>
              <th className="label-caps px-3 py-2">%</th>
              <th className="label-caps px-3 py-2">pieces</th>
              <th className="label-caps px-4 py-2">cost</th>
            </tr>
          </thead>
          <tbody>
            {rows.map(({ s, d }) => (
              <tr key={s.id} className="border-b border-line text-right font-mono last:border-b-0">
                <td className="px-4 py-2 text-left font-sans">{s.name}</td>
                <td className="px-3 py-2">{signed(u.small(d.steelWeight_lb), int)}</td>
                <td className="px-3 py-2">{signed(u.big(d.steelWeight_lb), one)}</td>
                <td className="px-3 py-2">{d.steel_psf === null ? '—' : signed(u.perArea(d.steel_psf), u.perAreaFmt)}</td>
                <td className="px-3 py-2">{d.steelWeight_pct === null ? '—' : `${signed(d.steelWeight_pct, one)} %`}</td>
                <td className="px-3 py-2">{signed(d.pieces, int)}</td>
                <td className="px-4 py-2">{d.cost_usd === null ? '—' : signedUsd(d.cost_usd)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/**
 * Tonnage: pick two to four schemes and compare them side by side. The page supplies each
 * card's actions (status controls) and what goes under the comparison (review panel).
 */
export function ComparisonView({
  comparison,
  schemeActions,
  unitPricesLink,
}: {
  comparison: Comparison;
  schemeActions?: (scheme: ComparisonScheme) => ReactNode;
  unitPricesLink?: ReactNode;
}) {
  const all = comparison.schemes;
  const { system } = useUnits();
  const [picked, setPicked] = useState<string[] | null>(null);
  const selection = picked ?? defaultSelection(all);
  const shown = useMemo(() => all.filter((s) => selection.includes(s.id)), [all, selection]);
  const base = baseScheme(shown);

  if (all.length === 0) {
    return (
      <EmptyState title="Nothing to compare yet">
        Tonnage compares schemes by steel weight, steel per floor area, piece count and cost, level by level. Start a
        scheme on the Schemes page; it is designed when it is compared.
      </EmptyState>
    );
  }

  const toggle = (id: string) => {
    const next = selection.includes(id) ? selection.filter((x) => x !== id) : [...selection, id];
    setPicked(all.filter((s) => next.includes(s.id)).map((s) => s.id));
  };
  const lightest = shown.filter((s) => s.totals).sort((a, b) => a.totals!.steelWeight_lb - b.totals!.steelWeight_lb)[0];
  const cheapest = shown.filter((s) => s.totals?.cost_usd != null).sort((a, b) => a.totals!.cost_usd! - b.totals!.cost_usd!)[0];
  const prices = comparison.prices.prices;
  const ids = shown.map((s) => s.id);

  return (
    <div className="flex flex-col gap-5">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <fieldset className="flex flex-col gap-1.5">
          <legend className="label-caps mb-1 text-ink">Schemes compared (two to four)</legend>
          <div className="flex flex-wrap gap-x-4 gap-y-1">
            {all.map((s) => {
              const on = selection.includes(s.id);
              return (
                <label key={s.id} className="flex items-center gap-1.5 text-sm">
                  <input
                    type="checkbox"
                    checked={on}
                    disabled={!on && selection.length >= MAX_COMPARED}
                    onChange={() => toggle(s.id)}
                    className="accent-accent"
                  />
                  {s.name}
                </label>
              );
            })}
          </div>
          {shown.length < 2 ? <p className="text-xs text-notice">Pick at least two schemes to see differences.</p> : null}
        </fieldset>
        <div className="flex flex-wrap gap-2">
          <a className={buttonClasses('secondary', 'h-8 text-xs')} href={comparisonPath(comparison.project.id, '.csv', ids)} download>
            Export CSV
          </a>
          <a className={buttonClasses('secondary', 'h-8 text-xs')} href={comparisonPath(comparison.project.id, '.pdf', ids)} download>
            Export PDF
          </a>
        </div>
      </div>

      <p className="text-sm text-ink-soft" data-testid="price-basis">
        {prices ? (
          <>
            Costs at ${int.format(prices.steel_usd_per_ton)} per ton{system === 'SI' ? ` (short ton, ${one.format(KG_PER_SHORT_TON)} kg)` : ''} fabricated and erected and ${int.format(prices.connection_usd_each)} per connection
            {prices.stud_usd_each != null ? `, $${two.format(prices.stud_usd_each)} per shear stud` : ''}
            {prices.camber_usd_each != null ? `, $${int.format(prices.camber_usd_each)} per cambered piece` : ''}
            {prices.example ? (
              <strong className="font-semibold text-notice"> (invented example prices, not market prices)</strong>
            ) : null}
            .{comparison.prices.notYetPriced.length ? ` Not yet priced: ${comparison.prices.notYetPriced.join(', ').toLowerCase()}.` : ''}{' '}
          </>
        ) : (
          <>No unit prices are set, so costs are not estimated. </>
        )}
        {unitPricesLink}
      </p>

      {base && shown.length >= 2 ? <Differences base={base} others={shown.filter((s) => s !== base)} /> : null}

      <div className={`grid gap-4 sm:grid-cols-2 ${shown.length >= 4 ? 'xl:grid-cols-4' : shown.length === 3 ? 'lg:grid-cols-3' : ''}`}>
        {shown.map((s) => {
          const marks: string[] = [];
          if (s === base && shown.length > 1) marks.push('baseline');
          if (shown.length > 1 && s === lightest) marks.push('lightest');
          if (shown.length > 1 && s === cheapest) marks.push('cheapest');
          return (
            <SchemeCard
              key={s.id}
              scheme={s}
              colour={SCHEME_COLOURS[all.filter((x) => x.totals && ids.includes(x.id)).indexOf(s) % SCHEME_COLOURS.length] ?? SCHEME_COLOURS[0]}
              marks={marks}
              actions={schemeActions?.(s)}
            />
          );
        })}
      </div>

      <TonnageCharts schemes={shown} system={system} />

      <p className="text-xs text-ink-soft">{comparison.basis}</p>
    </div>
  );
}
