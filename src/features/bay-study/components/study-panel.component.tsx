import { useEffect, useMemo, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import { Bar, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { Plan, PlanMember } from '../../../../shared/schemas/plan.schema';
import { parseStudySpec, MAX_STUDY_OPTIONS, type StudySpec } from '../../../../shared/schemas/study.schema';
import { STUDY_BASIS, applyStudyOption, levelBays, memberInBays, studyOptionSpecs, type Bay, type StudyOptionResult, type StudyResult } from '../../../../shared/engine/index';
import { pointInPolygon } from '../../../../shared/engine/geometry/polygon.geometry';
import { Button } from '../../../components/ui/button.ui';
import { EngineerCaution } from '../../../components/ui/engineer-caution.ui';
import { useUnits } from '../../../lib/units-context';
import { StudyRunner } from '../study/study-runner';
import { studyUnits, type StudyUnits } from './study-units';
import { useMakeStudyScheme } from '../api/make-study-scheme.api';

export interface StudyPreviewArg {
  levelId: string;
  bays: Bay[];
  members: PlanMember[] | null;
}

export interface StudyPanelProps {
  projectId: string;
  schemeId: string;
  plan: Plan;
  levelId: string;
  selection: string[];
  savedRevision: number;
  saved: boolean;
  canEdit: boolean;
  prices: { steel_usd_per_ton: number; connection_usd_each: number } | null;
  tonnageHref: string;
  setPreview: (p: StudyPreviewArg | null) => void;
  close: () => void;
  /** Tests pass a runner without a worker. */
  runner?: StudyRunner;
}

const bayKey = (b: Bay) => `${b.x0},${b.y0},${b.x1},${b.y1}`;
const usd = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD', maximumFractionDigits: 0 });
const FIELD = 'h-8 w-20 border border-ink/60 bg-paper-raised px-2 text-sm figures';

/** "1–2 / A–B" from the grid labels at the bay edges, else the coordinates. */
function bayLabel(plan: Plan, b: Bay, u: StudyUnits): string {
  const label = (axis: 'x' | 'y', v: number) => (plan.grids ?? []).find((g) => g.axis === axis && Math.abs(g.offset_ft - v) < 0.01)?.label;
  const [a, bb, c, d] = [label('x', b.x0), label('x', b.x1), label('y', b.y0), label('y', b.y1)];
  const size = `${u.length(b.x1 - b.x0)} × ${u.length(b.y1 - b.y0)} ${u.lengthUnit}`;
  return a && bb && c && d ? `Bay ${a}–${bb} / ${c}–${d} (${size})` : `Bay at ${u.length(b.x0)}, ${u.length(b.y0)} ${u.lengthUnit} (${size})`;
}

/** The bay a selected deck or member sits in (its centre), to start the study from. */
function bayOfSelection(plan: Plan, levelId: string, selection: string[], bays: Bay[]): Bay | null {
  for (const id of selection) {
    const m = plan.members.find((x) => x.id === id && x.level === levelId);
    const d = plan.decks.find((x) => x.id === id && x.level === levelId);
    if (!m && !d) continue;
    const hit = bays.find((b) => (m ? memberInBays(m, [b]) : d ? pointInPolygon([(b.x0 + b.x1) / 2, (b.y0 + b.y1) / 2], d.polygon) : false));
    if (hit) return hit;
  }
  return null;
}

/** "none, 18, 21" → [null, 18, 21]; a word that is not a number stays as text so the check can name it. */
function listOf(text: string, noneWord: string): (number | null)[] | string {
  const parts = text.split(',').map((p) => p.trim()).filter(Boolean);
  const out: (number | null)[] = [];
  for (const p of parts) {
    if (p.toLowerCase() === noneWord) out.push(null);
    else if (/^-?\d+(\.\d+)?$/.test(p)) out.push(Number(p));
    else return p;
  }
  return out;
}

function optionLabel(o: StudyOptionResult, u: StudyUnits): string {
  const layout = o.beamCount !== null ? `${o.beamCount} beams` : `≤ ${u.length(o.spacing_ft!)} ${u.lengthUnit}`;
  const depth = o.depthLimit_in !== null ? `, d ≤ ${u.depth(o.depthLimit_in)} ${u.depthUnit}` : '';
  const grade = o.Fy_ksi !== 50 ? `, Fy ${u.stress(o.Fy_ksi)} ${u.stressUnit}` : '';
  const composite = o.composite === true ? ', composite' : o.composite === false ? ', bare steel' : '';
  return `${o.direction === 'y' ? 'N–S' : 'E–W'} ${layout}${depth}${grade}${composite}`;
}

type CompositeChoice = 'plan' | 'both' | 'on' | 'off';
const COMPOSITE_VALUES: Record<CompositeChoice, (boolean | null)[]> = { plan: [null], both: [true, false], on: [true], off: [false] };

/** "6, 15, 1" typed in one system's units → the same values in the other's (each entry of a list; words kept). */
function convertText(text: string, toUS: (v: number) => number, fromUS: (v: number) => string): string {
  return text
    .split(',')
    .map((p) => {
      const t = p.trim();
      return /^-?\d+(\.\d+)?$/.test(t) ? fromUS(toUS(Number(t))) : t;
    })
    .join(', ');
}

/** Trial framings: a study of framing options for bays of the level shown. */
export function StudyPanel(props: StudyPanelProps) {
  const { plan, levelId, setPreview } = props;
  const { system } = useUnits();
  const u = studyUnits(system);
  const bays = useMemo(() => levelBays(plan, levelId), [plan, levelId]);
  const [regionMode, setRegionMode] = useState<'bays' | 'level'>('bays');
  const [picked, setPicked] = useState<string[]>(() => {
    const b = bayOfSelection(plan, levelId, props.selection, bays) ?? bays[0];
    return b ? [bayKey(b)] : [];
  });
  const [layoutMode, setLayoutMode] = useState<'spacing' | 'count'>('spacing');
  const [from, setFrom] = useState(u.defaultRange.from);
  const [to, setTo] = useState(u.defaultRange.to);
  const [step, setStep] = useState(u.defaultRange.step);
  const [dirX, setDirX] = useState(true);
  const [dirY, setDirY] = useState(true);
  const [depths, setDepths] = useState('none');
  const [grades, setGrades] = useState(u.stress(plan.designBasis.Fy_ksi));
  const [compositeChoice, setCompositeChoice] = useState<CompositeChoice>('plan');
  // What is typed follows the units switch: the fields are converted when it changes.
  const typedIn = useRef(system);
  useEffect(() => {
    if (typedIn.current === system) return;
    const was = studyUnits(typedIn.current);
    typedIn.current = system;
    if (layoutMode === 'spacing') {
      setFrom((t) => convertText(t, was.lengthIn, u.length));
      setTo((t) => convertText(t, was.lengthIn, u.length));
      setStep((t) => convertText(t, was.lengthIn, u.length));
    }
    setDepths((t) => convertText(t, was.depthIn, u.depth));
    setGrades((t) => convertText(t, was.stressIn, u.stress));
  }, [system, layoutMode, u]);
  const [problems, setProblems] = useState<string[]>([]);
  const [progress, setProgress] = useState<{ done: number; total: number } | null>(null);
  const [result, setResult] = useState<{ result: StudyResult; spec: StudySpec; request: Record<string, unknown>; engineMs: number; totalMs: number; plan: Plan } | null>(null);
  const [previewId, setPreviewId] = useState<string | null>(null);
  const runnerRef = useRef<StudyRunner | null>(props.runner ?? null);
  const make = useMakeStudyScheme(props.projectId, props.schemeId);

  runnerRef.current ??= new StudyRunner();
  useEffect(() => () => runnerRef.current?.dispose(), []);
  // Load the engine and design the plan ahead of a run (again after edits, once they settle).
  useEffect(() => {
    const t = setTimeout(() => runnerRef.current?.warm(plan), 300);
    return () => clearTimeout(t);
  }, [plan]);
  // Shade the bays picked (until an option is previewed).
  useEffect(() => {
    if (previewId) return;
    const chosen = regionMode === 'level' ? [] : bays.filter((b) => picked.includes(bayKey(b)));
    setPreview(chosen.length ? { levelId, bays: chosen, members: null } : null);
  }, [picked, regionMode, bays, levelId, previewId, setPreview]);

  const request = (): Record<string, unknown> | string => {
    const num = (s: string) => (s.trim() === '' ? NaN : Number(s));
    const d = listOf(depths, 'none');
    if (typeof d === 'string') return `depthLimits_in: "${d}" is not a depth in ${u.depthUnit === 'in' ? 'inches' : 'mm'} (or "none")`;
    const g = listOf(grades, 'plan');
    if (typeof g === 'string') return `Fy_ksi: "${g}" is not a yield stress in ${u.stressUnit}`;
    const shown = { from: num(from), to: num(to), step: num(step) };
    if (layoutMode === 'spacing' && system === 'SI') {
      // Named in the units typed (the engine's own check speaks in ft).
      for (const k of ['from', 'to', 'step'] as const) {
        if (!(shown[k] > 0)) return `spacing_ft.${k}: must be more than 0 m (got ${Number.isNaN(shown[k]) ? 'nothing' : shown[k]})`;
      }
      if (shown.from > shown.to) return `spacing_ft.from: must not be more than to (${shown.from} m > ${shown.to} m)`;
    }
    const range = layoutMode === 'spacing' ? { from: u.lengthIn(shown.from), to: u.lengthIn(shown.to), step: u.lengthIn(shown.step) } : shown;
    const chosen = bays.filter((b) => picked.includes(bayKey(b)));
    return {
      region: regionMode === 'level'
        ? { level: levelId, wholeLevel: true }
        : { level: levelId, polygons: chosen.map((b) => [[b.x0, b.y0], [b.x1, b.y0], [b.x1, b.y1], [b.x0, b.y1]]) },
      ...(layoutMode === 'spacing' ? { spacing_ft: range } : { beamCount: range }),
      directions: [...(dirX ? ['x'] : []), ...(dirY ? ['y'] : [])],
      depthLimits_in: d.map((v) => (v === null ? null : u.depthIn(v))),
      Fy_ksi: g.map((v) => (v === null ? null : u.stressIn(v))),
      composite: COMPOSITE_VALUES[compositeChoice],
    };
  };

  const run = () => {
    const req = request();
    if (typeof req === 'string') return setProblems([req]);
    const { spec, problems: p } = parseStudySpec({ ...req, unitPrices: props.prices });
    setProblems(p);
    if (!spec) return;
    const runner = runnerRef.current!;
    const clickedAt = performance.now();
    setProgress({ done: 0, total: studyOptionSpecs(spec).length });
    setPreviewId(null);
    const planAtRun = plan;
    runner.run(planAtRun, spec, {
      onProgress: (done, total) => setProgress({ done, total }),
      onDone: (r, engineMs) => {
        setProgress(null);
        setResult({ result: r, spec, request: req, engineMs, totalMs: performance.now() - clickedAt, plan: planAtRun });
      },
      onError: (message, ps) => {
        setProgress(null);
        setProblems(ps.length ? ps : [message]);
      },
    });
  };

  const cancel = () => {
    runnerRef.current?.cancel();
    setProgress(null);
    setProblems(['Study cancelled: no results were kept.']);
  };

  const preview = (o: StudyOptionResult) => {
    if (!result) return;
    const applied = applyStudyOption(result.plan, result.result.level, result.result.bays, studyOptionSpecs(result.spec)[o.index]);
    if (!applied.ok) return;
    setPreviewId(o.id);
    setPreview({ levelId: result.result.level, bays: result.result.bays, members: applied.plan.members.filter((m) => m.level === result.result.level && memberInBays(m, result.result.bays)) });
  };

  const options = result?.result.options ?? [];
  const chartData = options.map((o) => ({ name: optionLabel(o, u), psf: u.perAreaValue(o.steel_psf), cost: o.scheme.cost === null ? null : Math.round(o.scheme.cost) }));
  const stale = result !== null && result.plan !== plan;

  return (
    <section aria-labelledby="study-title" className="flex flex-col gap-3" data-testid="study-panel">
      <div className="flex items-baseline justify-between gap-3">
        <h2 id="study-title" className="label-caps text-ink">Trial framings</h2>
        <Button variant="quiet" className="h-7 text-xs" onClick={props.close}>Close</Button>
      </div>
      <p className="text-xs text-ink-soft">
        Tries beam spacings, directions and composite or bare steel for the bays you pick, lays each out as the Infill tool would, and designs the whole scheme with each. At most {MAX_STUDY_OPTIONS} options a run.
      </p>
      <fieldset className="flex flex-wrap items-start gap-6 text-sm">
        <div className="flex flex-col gap-1">
          <legend className="label-caps text-xs">Where</legend>
          <label className="flex items-center gap-2"><input type="radio" name="study-region" checked={regionMode === 'bays'} onChange={() => setRegionMode('bays')} /> Bays</label>
          <label className="flex items-center gap-2"><input type="radio" name="study-region" checked={regionMode === 'level'} onChange={() => setRegionMode('level')} /> Whole level</label>
        </div>
        {regionMode === 'bays' ? (
          <div className="flex max-h-32 flex-col gap-0.5 overflow-auto pr-2" role="group" aria-label="Bays to study">
            {bays.length === 0 ? <p className="text-xs text-ink-soft">Lay out grid lines (or columns) first: a study works bay by bay.</p> : null}
            {bays.map((b) => {
              const k = bayKey(b);
              return (
                <label key={k} className="flex items-center gap-2 text-xs">
                  <input type="checkbox" checked={picked.includes(k)} onChange={(e) => setPicked((p) => (e.target.checked ? [...p, k] : p.filter((x) => x !== k)))} />
                  {bayLabel(plan, b, u)}
                </label>
              );
            })}
          </div>
        ) : null}
        <div className="flex flex-col gap-1">
          <span className="label-caps text-xs">Beams</span>
          <label className="flex items-center gap-2"><input type="radio" name="study-layout" checked={layoutMode === 'spacing'} onChange={() => setLayoutMode('spacing')} /> Max spacing, {u.lengthUnit}</label>
          <label className="flex items-center gap-2"><input type="radio" name="study-layout" checked={layoutMode === 'count'} onChange={() => setLayoutMode('count')} /> Beams per bay</label>
        </div>
        <div className="flex items-end gap-2">
          <label className="flex flex-col text-xs">From<input aria-label="From" className={FIELD} inputMode="decimal" value={from} onChange={(e) => setFrom(e.target.value)} /></label>
          <label className="flex flex-col text-xs">To<input aria-label="To" className={FIELD} inputMode="decimal" value={to} onChange={(e) => setTo(e.target.value)} /></label>
          <label className="flex flex-col text-xs">Step<input aria-label="Step" className={FIELD} inputMode="decimal" value={step} onChange={(e) => setStep(e.target.value)} /></label>
        </div>
        <div className="flex flex-col gap-1">
          <span className="label-caps text-xs">Beams run</span>
          <label className="flex items-center gap-2"><input type="checkbox" checked={dirY} onChange={(e) => setDirY(e.target.checked)} /> North–south (y)</label>
          <label className="flex items-center gap-2"><input type="checkbox" checked={dirX} onChange={(e) => setDirX(e.target.checked)} /> East–west (x)</label>
        </div>
        <label className="flex flex-col text-xs">Depth limits d, {u.depthUnit}<input aria-label="Depth limits" className={`${FIELD} w-32`} value={depths} onChange={(e) => setDepths(e.target.value)} /></label>
        <label className="flex flex-col text-xs">Fy, {u.stressUnit} (whole scheme)<input aria-label="Steel grades" className={`${FIELD} w-32`} value={grades} onChange={(e) => setGrades(e.target.value)} /></label>
        <label className="flex flex-col text-xs">
          Composite (the bays’ framing)
          <select aria-label="Composite" className="h-8 border border-ink/60 bg-paper-raised px-1 text-sm" value={compositeChoice} onChange={(e) => setCompositeChoice(e.target.value as CompositeChoice)}>
            <option value="plan">As the plan has it</option>
            <option value="both">Try composite and bare steel</option>
            <option value="on">Composite</option>
            <option value="off">Bare steel</option>
          </select>
        </label>
      </fieldset>
      <div className="flex flex-wrap items-center gap-3">
        <Button variant="primary" className="h-8 text-xs" onClick={run} disabled={progress !== null || (regionMode === 'bays' && picked.length === 0)}>Run study</Button>
        {progress ? (
          <>
            <progress aria-label="Study progress" max={progress.total} value={progress.done} className="h-2 w-48" />
            <span className="figures text-xs" data-testid="study-progress">{progress.done} of {progress.total} options</span>
            <Button variant="secondary" className="h-8 text-xs" onClick={cancel}>Cancel</Button>
          </>
        ) : null}
        {!props.prices ? <span className="text-xs text-notice">No unit prices are set: costs are not estimated.</span> : null}
      </div>
      {problems.length ? (
        <ul role="alert" className="border-l-2 border-danger bg-danger-wash px-3 py-2 text-xs text-danger">
          {problems.map((p) => <li key={p}>{p}</li>)}
        </ul>
      ) : null}
      {result ? (
        <div className="flex flex-col gap-3" data-testid="study-results">
          <p className="text-xs text-ink-soft" data-testid="study-timing" data-engine-ms={result.engineMs.toFixed(1)} data-total-ms={result.totalMs.toFixed(1)}>
            {options.length} options in {(result.totalMs / 1000).toFixed(2)} s · now {u.big(result.result.current.steelWeight_lb)} {u.bigUnit}
            {result.result.current.cost !== null ? `, ${usd.format(result.result.current.cost)}` : ''}
            {stale ? ' · the plan has changed since: run again before making a scheme' : ''}
          </p>
          <figure className="border border-ink/70 bg-paper-raised p-3" data-testid="study-chart">
            <figcaption className="label-caps mb-2 text-xs">Bay steel ({u.perAreaUnit}) and scheme cost by option</figcaption>
            <div className="h-56 w-full">
              <ResponsiveContainer width="100%" height="100%">
                <ComposedChart data={chartData} margin={{ top: 8, right: 16, bottom: 40, left: 8 }}>
                  <CartesianGrid stroke="#d8d2c4" vertical={false} />
                  <XAxis dataKey="name" angle={-30} textAnchor="end" interval={0} height={60} tick={{ fontSize: 10 }} />
                  <YAxis yAxisId="psf" tick={{ fontSize: 10 }} label={{ value: u.perAreaUnit, angle: -90, position: 'insideLeft', fontSize: 10 }} />
                  <YAxis yAxisId="cost" orientation="right" tick={{ fontSize: 10 }} />
                  <Tooltip />
                  <Legend />
                  <Bar yAxisId="psf" dataKey="psf" name={`Bay steel, ${u.perAreaUnit}`} fill="#2b3fc2" isAnimationActive={false} />
                  {props.prices ? <Line yAxisId="cost" dataKey="cost" name="Scheme cost, USD" stroke="#b0792a" dot isAnimationActive={false} /> : null}
                </ComposedChart>
              </ResponsiveContainer>
            </div>
          </figure>
          <div className="overflow-auto">
            <table className="figures w-full text-xs" aria-label="Trial framing options">
              <thead>
                <tr className="border-b border-ink text-left">
                  <th className="py-1 pr-2">Option</th><th className="pr-2">Beams</th><th className="pr-2 text-right">Bay {u.perAreaUnit}</th><th className="pr-2 text-right">Scheme {u.bigUnit}</th>
                  <th className="pr-2 text-right">Cost</th><th className="pr-2 text-right">Pieces</th><th className="pr-2 text-right">Conn.</th><th className="pr-2 text-right">Max d, {u.depthUnit}</th>
                  <th className="pr-2">Governing</th><th className="pr-2">Result</th><th />
                </tr>
              </thead>
              <tbody>
                {options.map((o) => (
                  <tr key={o.id} data-option-id={o.id} className={`border-b border-line ${previewId === o.id ? 'bg-accent-wash' : ''}`}>
                    <td className="py-1 pr-2">{optionLabel(o, u)}</td>
                    <td className="pr-2">{o.beams === null ? '—' : `${o.beams} @ ${u.length(o.beamSpacing_ft!)} ${u.lengthUnit}`}</td>
                    <td className="pr-2 text-right">{o.error ? '—' : u.perArea(o.steel_psf)}</td>
                    <td className="pr-2 text-right">{o.error ? '—' : u.big(o.scheme.steelWeight_lb)}</td>
                    <td className="pr-2 text-right">{o.scheme.cost === null || o.error ? '—' : usd.format(o.scheme.cost)}</td>
                    <td className="pr-2 text-right">{o.error ? '—' : o.pieces}</td>
                    <td className="pr-2 text-right">{o.error ? '—' : o.connections}</td>
                    <td className="pr-2 text-right">{o.maxDepth_in === null ? '—' : u.depth(o.maxDepth_in)}</td>
                    <td className="pr-2">{o.governing ? `${o.governing} (${o.governingMember}, ${o.governingRatio?.toFixed(2)})` : o.error ?? '—'}</td>
                    <td className="pr-2">
                      {o.passes ? 'passes' : o.error ? 'cannot lay out' : `does not pass${o.failingMembers ? ` (${o.failingMembers} failing)` : ''}`}
                      {o.lightest ? <strong className="ml-1 border border-ink px-1">Lightest</strong> : null}
                      {o.cheapest ? <strong className="ml-1 border border-ink px-1">Cheapest</strong> : null}
                      {o.shallowest ? <strong className="ml-1 border border-ink px-1">Shallowest</strong> : null}
                    </td>
                    <td className="whitespace-nowrap">
                      {o.error ? null : <Button variant="quiet" className="h-6 px-2 text-xs" onClick={() => preview(o)} aria-label={`Preview ${optionLabel(o, u)}`}>Preview</Button>}
                      {props.canEdit && o.passes ? (
                        <Button
                          variant="quiet"
                          className="h-6 px-2 text-xs"
                          disabled={!props.saved || stale || make.isPending}
                          title={!props.saved ? 'Wait for the plan to save' : undefined}
                          aria-label={`Make a scheme from ${optionLabel(o, u)}`}
                          onClick={() => make.mutate({ request: result.request, revision: props.savedRevision, optionId: o.id })}
                        >
                          Make a scheme from this
                        </Button>
                      ) : null}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {make.isError ? <p role="alert" className="text-xs text-danger">{make.error.message}</p> : null}
          {make.data ? (
            <p role="status" className="text-xs">
              Scheme “{make.data.scheme.name}” made. <Link className="text-accent underline" to={props.tonnageHref}>Compare it on Tonnage</Link>
            </p>
          ) : null}
          <p className="text-xs text-ink-soft">{STUDY_BASIS}</p>
          <EngineerCaution />
        </div>
      ) : null}
    </section>
  );
}
