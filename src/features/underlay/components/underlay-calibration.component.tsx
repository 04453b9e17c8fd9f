// Calibrating an underlay: pick two points on the image (click, or type their pixel
// coordinates), type the real distance between them, and optionally the plan point where the
// first one belongs (a grid intersection, say). Saves scale and origin through onSave.
import { useId, useRef, useState, type MouseEvent } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { TextField } from '../../../components/ui/field.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { formatQuantity, parseQuantity, unitLabel, type UnitSystem } from '../../../lib/units';
import type { Underlay, UnderlayPlacement } from '../api/underlay.schema';
import { calibrateUnderlay } from '../lib/underlay-placement';
import { useUnderlayPicture } from './underlay-image.component';

type Props = {
  underlay: Underlay;
  units: UnitSystem;
  onSave: (placement: UnderlayPlacement) => Promise<unknown> | unknown;
  onCancel: () => void;
};

type Pick = { x: string; y: string };
const EMPTY: Pick = { x: '', y: '' };

function toPx(p: Pick): [number, number] | null {
  if (p.x.trim() === '' || p.y.trim() === '') return null;
  const x = Number(p.x);
  const y = Number(p.y);
  return Number.isFinite(x) && Number.isFinite(y) ? [x, y] : null;
}

export function UnderlayCalibration({ underlay, units, onSave, onCancel }: Props) {
  const id = useId();
  const imgRef = useRef<HTMLImageElement>(null);
  const picture = useUnderlayPicture(underlay);
  const [a, setA] = useState<Pick>(EMPTY);
  const [b, setB] = useState<Pick>(EMPTY);
  const [next, setNext] = useState<'A' | 'B'>('A');
  const [distance, setDistance] = useState('');
  const [planA, setPlanA] = useState<Pick>(EMPTY);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [saving, setSaving] = useState(false);
  const [serverError, setServerError] = useState<string | null>(null);

  const pickOnImage = (e: MouseEvent<HTMLImageElement>) => {
    const img = imgRef.current;
    if (!img) return;
    const rect = img.getBoundingClientRect();
    if (rect.width === 0 || rect.height === 0) return;
    const u = ((e.clientX - rect.left) * underlay.width_px) / rect.width;
    const v = ((e.clientY - rect.top) * underlay.height_px) / rect.height;
    const pick = { x: u.toFixed(1), y: v.toFixed(1) };
    if (next === 'A') setA(pick);
    else setB(pick);
    setNext(next === 'A' ? 'B' : 'A');
  };

  const save = async () => {
    const found: Record<string, string> = {};
    const pa = toPx(a);
    const pb = toPx(b);
    if (!pa) found.a = 'Pick point A on the image or type its pixel x and y';
    if (!pb) found.b = 'Pick point B on the image or type its pixel x and y';
    const d = parseQuantity('length_ft', distance, units);
    if (!d.ok) found.distance = d.error;
    let planPoint: [number, number] | null = null;
    if (planA.x.trim() !== '' || planA.y.trim() !== '') {
      const px = parseQuantity('length_ft', planA.x, units);
      const py = parseQuantity('length_ft', planA.y, units);
      if (!px.ok) found.planAx = px.error;
      if (!py.ok) found.planAy = py.error;
      if (px.ok && py.ok) planPoint = [px.value, py.value];
    }
    if (Object.keys(found).length === 0 && pa && pb && d.ok) {
      const result = calibrateUnderlay(pa, pb, planPoint, d.value, {
        rotation_deg: underlay.placement.rotation_deg,
        origin_ft: underlay.placement.origin_ft,
      });
      if (!result.ok) {
        found[result.field === 'points' ? 'b' : 'distance'] = result.error;
      } else {
        setErrors({});
        setSaving(true);
        setServerError(null);
        try {
          await onSave(result.placement);
        } catch (error) {
          setServerError(error instanceof Error ? error.message : 'The calibration could not be saved.');
        } finally {
          setSaving(false);
        }
        return;
      }
    }
    setErrors(found);
  };

  const lengthUnit = unitLabel('length_ft', units);
  const markerStyle = (p: Pick) => {
    const px = toPx(p);
    return px ? { left: `${(px[0] / underlay.width_px) * 100}%`, top: `${(px[1] / underlay.height_px) * 100}%` } : null;
  };
  const ma = markerStyle(a);
  const mb = markerStyle(b);

  return (
    <div role="dialog" aria-modal="true" aria-labelledby={`${id}-title`} className="flex flex-col gap-3 border border-ink bg-paper-raised p-4 shadow-[6px_6px_0_rgb(28_34_40/0.08)]">
      <h3 id={`${id}-title`} className="text-base font-semibold text-ink">
        Calibrate {underlay.filename}
      </h3>
      <p className="text-sm text-ink-soft">
        Click two points on the image whose real distance you know (two grid lines, a dimensioned wall), far apart for
        accuracy; next click sets point <strong>{next}</strong>. Then type the distance between them.
      </p>
      <div className="relative max-h-[360px] overflow-auto border border-line">
        <div className="relative inline-block">
          {picture.error ? <FormAlert>{picture.error}</FormAlert> : null}
          {!picture.url && !picture.error ? <p className="p-3 text-sm text-ink-soft">Drawing page {underlay.page} of the PDF…</p> : null}
          <img
            ref={imgRef}
            src={picture.url ?? undefined}
            alt={`Underlay ${underlay.filename}`}
            onClick={pickOnImage}
            className="block max-w-full cursor-crosshair select-none"
            draggable={false}
          />
          {ma ? <span aria-hidden className="absolute -ml-2 -mt-2 size-4 rounded-full border-2 border-accent bg-accent/20" style={ma} /> : null}
          {mb ? <span aria-hidden className="absolute -ml-2 -mt-2 size-4 rounded-full border-2 border-danger bg-danger/20" style={mb} /> : null}
        </div>
      </div>
      <div className="grid gap-3 sm:grid-cols-4">
        <TextField label="A: x (px)" inputMode="decimal" className="figures font-mono" value={a.x} onChange={(e) => setA({ ...a, x: e.target.value })} error={errors.a} />
        <TextField label="A: y (px)" inputMode="decimal" className="figures font-mono" value={a.y} onChange={(e) => setA({ ...a, y: e.target.value })} />
        <TextField label="B: x (px)" inputMode="decimal" className="figures font-mono" value={b.x} onChange={(e) => setB({ ...b, x: e.target.value })} error={errors.b} />
        <TextField label="B: y (px)" inputMode="decimal" className="figures font-mono" value={b.y} onChange={(e) => setB({ ...b, y: e.target.value })} />
      </div>
      <TextField
        label={`Real distance A–B (${lengthUnit})`}
        className="figures font-mono"
        value={distance}
        onChange={(e) => setDistance(e.target.value)}
        error={errors.distance}
        hint={units === 'US' ? `Feet, or feet and inches such as 30'-0"` : 'Metres'}
      />
      <fieldset className="grid gap-3 sm:grid-cols-2">
        <legend className="mb-1 text-sm text-ink-soft">Where A lies on the plan (optional; blank keeps the image's top-left corner where it is)</legend>
        <TextField label={`Plan x of A (${lengthUnit})`} optional className="figures font-mono" value={planA.x} onChange={(e) => setPlanA({ ...planA, x: e.target.value })} error={errors.planAx} />
        <TextField label={`Plan y of A (${lengthUnit})`} optional className="figures font-mono" value={planA.y} onChange={(e) => setPlanA({ ...planA, y: e.target.value })} error={errors.planAy} />
      </fieldset>
      <FormAlert>{serverError}</FormAlert>
      <p className="figures text-xs text-ink-faint">
        Now: 1 px = {formatQuantity('length_ft', underlay.placement.scale_ft_per_px, units, { digits: 4 })}; top-left corner at (
        {formatQuantity('length_ft', underlay.placement.origin_ft[0], units)}, {formatQuantity('length_ft', underlay.placement.origin_ft[1], units)}).
      </p>
      <div className="flex gap-2">
        <Button onClick={save} pending={saving}>
          Save calibration
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </div>
  );
}
