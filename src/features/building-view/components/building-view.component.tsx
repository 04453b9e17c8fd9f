/**
 * Building view: every level's members and column lengths in 3D, as extruded W-shapes
 * coloured by the utilisation ramp (the ratio is printed on hover, never colour alone).
 *
 *   <BuildingView
 *     plan={the plan being edited}            // levels, members, columns
 *     design={the live design or null}        // ratios and sizes; without it sizes are "not sized"
 *     selection={the editor's selected ids}
 *     onSelect={(piece) => …}                  // a click on a piece: its plan element id and level; null on empty space
 *   />
 *
 * Drag to orbit, right-drag or shift-drag to pan, wheel to zoom. Levels can be hidden. When
 * the browser offers no WebGL the view says so and lists what it would have drawn.
 */
import { useEffect, useMemo, useRef, useState, type PointerEvent } from 'react';
import { buildingModel, type BuildingDesignInput, type BuildingModel, type BuildingPlanInput } from '../../../../shared/drafting/building-model.drafting';
import { Button } from '../../../components/ui/button.ui';
import { utilisation, UTILISATION_LIMITS, type UtilisationBand } from '../../../lib/utilisation';
import { BuildingScene, type ScenePiece } from '../lib/building-scene';
import { webglAvailable } from '../lib/webgl-support';

export interface BuildingViewProps {
  plan: BuildingPlanInput;
  design: BuildingDesignInput | null;
  selection: readonly string[];
  onSelect: (piece: { elementId: string; level: string } | null) => void;
}

const BANDS: UtilisationBand[] = ['spare', 'working', 'near', 'over', 'none'];

function cssColour(name: string, fallback: string): string {
  if (typeof document === 'undefined') return fallback;
  return getComputedStyle(document.documentElement).getPropertyValue(name).trim() || fallback;
}

/** What hovering a piece says: mark, size, ratio and band. */
export function pieceText(model: BuildingModel, key: string): string {
  const m = model.members.find((x) => x.id === key);
  if (m) {
    const u = m.ratio === null ? null : utilisation(m.ratio);
    return `${m.mark || m.id} · ${m.kind} · ${m.size}${u ? ` · ratio ${u.printed} (${u.label})` : ' · no ratio yet'}`;
  }
  const c = model.columns.find((x) => x.id === key);
  if (c) {
    const u = c.ratio === null ? null : utilisation(c.ratio);
    return `Column ${c.columnId} below ${c.level} · ${c.size}${u ? ` · ratio ${u.printed} (${u.label})` : ' · no ratio yet'}`;
  }
  return key;
}

export function BuildingView({ plan, design, selection, onSelect }: BuildingViewProps) {
  const [webgl] = useState(() => webglAvailable());
  const model = useMemo(() => buildingModel(plan, design), [plan, design]);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const wrapRef = useRef<HTMLDivElement>(null);
  const sceneRef = useRef<BuildingScene | null>(null);
  const fitted = useRef(false);
  const [hidden, setHidden] = useState<Set<string>>(() => new Set());
  const [hover, setHover] = useState<{ x: number; y: number; text: string } | null>(null);
  const [turning, setTurning] = useState(false);
  const [fps, setFps] = useState<number | null>(null);
  const [failed, setFailed] = useState<string | null>(null);
  const down = useRef<{ x: number; y: number } | null>(null);
  const hoverFrame = useRef<number | null>(null);
  const onSelectRef = useRef(onSelect);
  onSelectRef.current = onSelect;

  const bandOf = useMemo(() => {
    const ratio = new Map<string, number | null>();
    for (const m of model.members) ratio.set(m.id, m.ratio);
    for (const c of model.columns) ratio.set(c.id, c.ratio);
    return (key: string) => {
      const r = ratio.get(key);
      return r === null || r === undefined ? 'none' : utilisation(r).band;
    };
  }, [model]);

  // The scene lives as long as the view.
  useEffect(() => {
    if (!webgl || !canvasRef.current || !wrapRef.current) return;
    let scene: BuildingScene;
    try {
      scene = new BuildingScene(canvasRef.current, cssColour('--color-paper-raised', '#fbf9f4'));
    } catch (error) {
      setFailed(error instanceof Error ? error.message : 'WebGL could not start.');
      return;
    }
    sceneRef.current = scene;
    scene.onFrame = ({ framesPerSecond, pieces }) => {
      const el = wrapRef.current;
      if (!el) return;
      el.dataset.frames = String(Number(el.dataset.frames ?? 0) + 1);
      el.dataset.pieces = String(pieces);
      if (framesPerSecond !== null) {
        el.dataset.fps = framesPerSecond.toFixed(1);
        setFps(Math.round(framesPerSecond));
      }
    };
    // For browser tests: where a piece is drawn on screen.
    (canvasRef.current as HTMLCanvasElement & { screenPointOf?: (key: string) => { x: number; y: number } | null }).screenPointOf = (key) => scene.screenPointOf(key);
    const wrap = wrapRef.current;
    const resize = () => scene.setSize(wrap.clientWidth, wrap.clientHeight);
    resize();
    const observer = new ResizeObserver(resize);
    observer.observe(wrap);
    return () => {
      observer.disconnect();
      scene.dispose();
      sceneRef.current = null;
      fitted.current = false;
    };
  }, [webgl]);

  useEffect(() => {
    const scene = sceneRef.current;
    if (!scene) return;
    const colours = Object.fromEntries(BANDS.map((b) => [b, cssColour(`--color-util-${b}`, '#b9b3a6')])) as Record<UtilisationBand, string>;
    scene.setModel(model, { colourOf: (key) => colours[bandOf(key)], selected: cssColour('--color-accent', '#2b3fc2') }, !fitted.current);
    fitted.current = true;
    scene.setHiddenLevels(hidden);
    scene.setSelected(selection);
    // eslint-disable-next-line react-hooks/exhaustive-deps -- hidden and selection have their own effects
  }, [model, bandOf]);

  useEffect(() => sceneRef.current?.setHiddenLevels(hidden), [hidden]);
  useEffect(() => sceneRef.current?.setSelected(selection), [selection]);
  useEffect(() => sceneRef.current?.setTurning(turning), [turning]);
  useEffect(() => () => void (hoverFrame.current && cancelAnimationFrame(hoverFrame.current)), []);

  const onPointerMove = (e: PointerEvent<HTMLCanvasElement>) => {
    if (e.buttons !== 0) {
      setHover(null);
      return;
    }
    const { clientX, clientY } = e;
    if (hoverFrame.current) cancelAnimationFrame(hoverFrame.current);
    hoverFrame.current = requestAnimationFrame(() => {
      hoverFrame.current = null;
      const piece = sceneRef.current?.pick(clientX, clientY);
      const rect = wrapRef.current?.getBoundingClientRect();
      setHover(piece && rect ? { x: clientX - rect.left, y: clientY - rect.top, text: pieceText(model, piece.key) } : null);
    });
  };

  const onPointerUp = (e: PointerEvent<HTMLCanvasElement>) => {
    const start = down.current;
    down.current = null;
    if (!start || Math.hypot(e.clientX - start.x, e.clientY - start.y) > 4 || e.button !== 0) return; // a drag orbits
    const piece: ScenePiece | null = sceneRef.current?.pick(e.clientX, e.clientY) ?? null;
    onSelectRef.current(piece ? { elementId: piece.elementId, level: piece.level } : null);
  };

  const levels = [...model.storeys].reverse();
  const counts = (level: string) => ({
    members: model.members.filter((m) => m.level === level).length,
    columns: model.columns.filter((c) => c.level === level).length,
  });

  return (
    <div className="flex h-full min-h-0 flex-col" data-testid="building-view-root">
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1 border-b border-line bg-paper px-3 py-1.5 text-xs">
        <fieldset className="flex flex-wrap items-center gap-3">
          <legend className="sr-only">Levels shown</legend>
          <span className="label-caps">Levels</span>
          {levels.map((l) => (
            <label key={l.id} className="inline-flex items-center gap-1">
              <input
                type="checkbox"
                className="size-3.5 accent-[var(--color-accent)]"
                checked={!hidden.has(l.id)}
                onChange={(e) =>
                  setHidden((prev) => {
                    const next = new Set(prev);
                    if (e.target.checked) next.delete(l.id);
                    else next.add(l.id);
                    return next;
                  })
                }
              />
              {l.name}
            </label>
          ))}
        </fieldset>
        {webgl && !failed ? (
          <div className="ml-auto flex items-center gap-2">
            <Button variant="quiet" className="h-7 px-2 text-xs" onClick={() => sceneRef.current?.fit()}>
              Fit building
            </Button>
            <Button variant="quiet" className="h-7 px-2 text-xs" aria-pressed={turning} onClick={() => setTurning((v) => !v)}>
              {turning ? 'Stop turning' : 'Turn'}
            </Button>
            {turning && fps !== null ? <span className="figures font-mono text-ink-soft">{fps} frames/s</span> : null}
          </div>
        ) : null}
      </div>
      {!webgl || failed ? (
        <div role="status" data-testid="building-view-fallback" className="flex flex-col gap-2 p-4 text-sm">
          <p className="font-medium text-ink">The Building view needs WebGL, which this browser does not offer or has turned off{failed ? ` (${failed})` : ''}.</p>
          <p className="text-ink-soft">Turn on hardware acceleration or WebGL in the browser settings, or use the Plan, Member sheet and Schedule, which show the same framing. What the view would draw:</p>
          <table className="figures w-auto border-collapse font-mono text-xs">
            <thead>
              <tr>
                <th className="border-b border-line px-2 py-1 text-left">Level</th>
                <th className="border-b border-line px-2 py-1 text-right">Members</th>
                <th className="border-b border-line px-2 py-1 text-right">Column lengths</th>
              </tr>
            </thead>
            <tbody>
              {levels.map((l) => (
                <tr key={l.id}>
                  <td className="px-2 py-0.5">{l.name}</td>
                  <td className="px-2 py-0.5 text-right">{counts(l.id).members}</td>
                  <td className="px-2 py-0.5 text-right">{counts(l.id).columns}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : (
        <div ref={wrapRef} className="relative min-h-0 flex-1" data-testid="building-view" data-members={model.members.length} data-columns={model.columns.length}>
          <canvas
            ref={canvasRef}
            className="block size-full touch-none"
            aria-label={`Building view: ${model.members.length} members and ${model.columns.length} column lengths on ${model.storeys.length} levels. Drag to orbit, wheel to zoom.`}
            onPointerDown={(e) => (down.current = { x: e.clientX, y: e.clientY })}
            onPointerUp={onPointerUp}
            onPointerMove={onPointerMove}
            onPointerLeave={() => setHover(null)}
          />
          {hover ? (
            <div role="tooltip" data-testid="building-hover" className="figures pointer-events-none absolute z-10 whitespace-nowrap border border-ink bg-paper-raised px-2 py-1 font-mono text-xs text-ink shadow" style={{ left: hover.x + 14, top: hover.y + 14 }}>
              {hover.text}
            </div>
          ) : null}
          <Legend />
        </div>
      )}
    </div>
  );
}

function Legend() {
  const rows: { band: UtilisationBand; text: string }[] = [
    { band: 'spare', text: `≤ ${UTILISATION_LIMITS.spare.toFixed(2)}` },
    { band: 'working', text: `≤ ${UTILISATION_LIMITS.working.toFixed(2)}` },
    { band: 'near', text: `≤ ${UTILISATION_LIMITS.near.toFixed(2)}` },
    { band: 'over', text: `> ${UTILISATION_LIMITS.near.toFixed(2)}` },
    { band: 'none', text: 'no ratio' },
  ];
  return (
    <ul aria-label="Utilisation colours" className="figures pointer-events-none absolute bottom-2 left-2 m-0 flex list-none flex-col gap-0.5 border border-line bg-paper-raised/90 p-2 font-mono text-[11px]">
      {rows.map((r) => (
        <li key={r.band} className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block size-3 border border-ink/40" style={{ background: `var(--color-util-${r.band})` }} />
          {utilisation(r.band === 'none' ? Number.NaN : r.band === 'over' ? 1.5 : UTILISATION_LIMITS[r.band]).label} {r.text}
        </li>
      ))}
      <li className="mt-1 text-ink-soft">Selected: accent colour</li>
    </ul>
  );
}
