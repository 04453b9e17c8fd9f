/**
 * Underlay panel: the architectural plan images under one level of a scheme.
 *
 *   <UnderlayPanel
 *     schemeId={scheme.id}
 *     levelId={plan level id, e.g. "L2"}
 *     canEdit={role may write the plan}        // false: list only, no upload, change or delete
 *     onPickCalibration={(underlay) => …}     // optional: offers "Pick on the plan", handing the
 *                                             // calibration to the canvas (see calibrateUnderlay,
 *                                             // planToImagePx and useUpdateUnderlay)
 *     units="US" | "SI"                       // optional; default the reader's stored choice
 *   />
 *
 * Upload (PNG, JPEG or PDF up to 10 MB; a PDF shows one page, chosen with the page picker and
 * rendered in the browser), show/hide, opacity, lock, calibrate in a dialog (two points on the
 * image and the real distance), delete. A locked underlay cannot be calibrated or change page.
 * Needs a QueryClientProvider above it. Draw the images with <UnderlayImage> (react-konva)
 * or drawUnderlay() (2D canvas) from the same useUnderlays(schemeId, levelId) data.
 */
import { useEffect, useId, useRef, useState, type ChangeEvent } from 'react';
import { Button } from '../../../components/ui/button.ui';
import { FormAlert } from '../../../components/ui/form-alert.ui';
import { Loading } from '../../../components/ui/loading.ui';
import { isApiError } from '../../../lib/api-client';
import { formatQuantity, type UnitSystem } from '../../../lib/units';
import { useUnits } from '../../../lib/units-context';
import { useDeleteUnderlay } from '../api/delete-underlay.api';
import { useUnderlays } from '../api/get-underlays.api';
import { useUpdateUnderlay } from '../api/update-underlay.api';
import { useUploadUnderlay } from '../api/upload-underlay.api';
import { UNDERLAY_MAX_BYTES, type Underlay } from '../api/underlay.schema';
import { UnderlayCalibration } from './underlay-calibration.component';
import { useUnderlayPicture } from './underlay-image.component';

export interface UnderlayPanelProps {
  schemeId: string;
  levelId: string;
  canEdit: boolean;
  onPickCalibration?: (underlay: Underlay) => void;
  units?: UnitSystem;
}

const ACCEPT = 'image/png,image/jpeg,application/pdf,.png,.jpg,.jpeg,.pdf';

function sizeText(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} kB`;
}

function errorText(error: unknown): string {
  if (isApiError(error)) return error.message;
  return 'Something went wrong. Try again.';
}

function UnderlayRow({
  underlay, schemeId, canEdit, units, onCalibrate, onPickCalibration,
}: {
  underlay: Underlay;
  schemeId: string;
  canEdit: boolean;
  units: UnitSystem;
  onCalibrate: () => void;
  onPickCalibration?: (u: Underlay) => void;
}) {
  const id = useId();
  const update = useUpdateUnderlay(schemeId);
  const remove = useDeleteUnderlay(schemeId);
  const [confirming, setConfirming] = useState(false);
  const [opacity, setOpacity] = useState(underlay.opacity);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(() => setOpacity(underlay.opacity), [underlay.opacity]);
  // The two check boxes follow a click in the same event (the query cache is updated a moment
  // later, after in-flight reads are cancelled), and then follow the stored value again.
  const [visible, setVisible] = useState(underlay.visible);
  const [locked, setLocked] = useState(underlay.locked);
  useEffect(() => setVisible(underlay.visible), [underlay.visible]);
  useEffect(() => setLocked(underlay.locked), [underlay.locked]);
  useEffect(() => () => {
    if (timer.current) clearTimeout(timer.current);
  }, []);

  const onOpacity = (e: ChangeEvent<HTMLInputElement>) => {
    const value = Number(e.target.value);
    setOpacity(value);
    if (timer.current) clearTimeout(timer.current);
    // One request when the slider settles, not one per step.
    timer.current = setTimeout(() => update.mutate({ underlayId: underlay.id, patch: { opacity: value } }), 250);
  };

  const p = underlay.placement;
  const isPdf = underlay.mime === 'application/pdf';
  const pageCount = underlay.pageCount ?? 1;
  return (
    <li className="flex flex-col gap-2 border-b border-line py-2" data-underlay={underlay.id}>
      <div className="flex items-baseline justify-between gap-2">
        <span className="truncate text-sm font-medium text-ink" title={underlay.filename}>
          {underlay.filename}
        </span>
        <span className="figures shrink-0 font-mono text-xs text-ink-faint">
          {isPdf ? `PDF page ${underlay.page ?? 1} of ${pageCount} · ${underlay.width_px} × ${underlay.height_px} pt` : `${underlay.width_px} × ${underlay.height_px} px`} ·{' '}
          {sizeText(underlay.bytes)}
        </span>
      </div>
      <p className="figures m-0 font-mono text-xs text-ink-soft">
        1 {isPdf ? 'pt' : 'px'} = {formatQuantity('length_ft', p.scale_ft_per_px, units, { digits: 4 })} · top-left ({formatQuantity('length_ft', p.origin_ft[0], units)},{' '}
        {formatQuantity('length_ft', p.origin_ft[1], units)})
      </p>
      {canEdit ? (
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <label className="inline-flex items-center gap-1.5">
            <input
              type="checkbox"
              checked={visible}
              onChange={(e) => {
                const was = visible;
                setVisible(e.target.checked);
                update.mutate({ underlayId: underlay.id, patch: { visible: e.target.checked } }, { onError: () => setVisible(was) });
              }}
              className="size-4 accent-[var(--color-accent)]"
            />
            Show
          </label>
          <label htmlFor={`${id}-opacity`} className="inline-flex items-center gap-1.5">
            Opacity
            <input id={`${id}-opacity`} type="range" min={0.05} max={1} step={0.05} value={opacity} onChange={onOpacity} className="w-24" />
            <span className="figures w-10 font-mono text-xs">{Math.round(opacity * 100)} %</span>
          </label>
          {isPdf ? (
            <label htmlFor={`${id}-page`} className="inline-flex items-center gap-1.5">
              Page
              <select
                id={`${id}-page`}
                value={underlay.page ?? 1}
                disabled={locked || update.isPending}
                onChange={(e) => update.mutate({ underlayId: underlay.id, patch: { page: Number(e.target.value) } })}
                className="h-8 rounded-[3px] border border-ink/60 bg-paper px-1 text-sm"
              >
                {Array.from({ length: pageCount }, (_, i) => (
                  <option key={i + 1} value={i + 1}>
                    {i + 1} of {pageCount}
                  </option>
                ))}
              </select>
            </label>
          ) : null}
          <label className="inline-flex items-center gap-1.5" title="A locked underlay keeps its place, scale and page">
            <input
              type="checkbox"
              checked={locked}
              onChange={(e) => {
                const was = locked;
                setLocked(e.target.checked);
                update.mutate({ underlayId: underlay.id, patch: { locked: e.target.checked } }, { onError: () => setLocked(was) });
              }}
              className="size-4 accent-[var(--color-accent)]"
            />
            Lock
          </label>
          <Button variant="secondary" onClick={onCalibrate} disabled={locked}>
            Calibrate
          </Button>
          {onPickCalibration ? (
            <Button variant="quiet" onClick={() => onPickCalibration(underlay)} disabled={locked}>
              Pick on the plan
            </Button>
          ) : null}
          {confirming ? (
            <>
              <Button variant="danger" pending={remove.isPending} onClick={() => remove.mutate(underlay.id)}>
                Delete {underlay.filename}
              </Button>
              <Button variant="quiet" onClick={() => setConfirming(false)}>
                Keep
              </Button>
            </>
          ) : (
            <Button variant="quiet" onClick={() => setConfirming(true)}>
              Delete…
            </Button>
          )}
        </div>
      ) : (
        <p className="m-0 text-xs text-ink-faint">
          {underlay.visible ? `Shown at ${Math.round(underlay.opacity * 100)} % opacity.` : 'Hidden.'}
          {underlay.locked ? ' Locked.' : ''}
        </p>
      )}
      {underlay.visible ? <PictureStatus underlay={underlay} /> : null}
      {update.isError ? <FormAlert>{errorText(update.error)}</FormAlert> : null}
      {remove.isError ? <FormAlert>{errorText(remove.error)}</FormAlert> : null}
    </li>
  );
}

export function UnderlayPanel({ schemeId, levelId, canEdit, onPickCalibration, units }: UnderlayPanelProps) {
  const stored = useUnits().system;
  const system = units ?? stored;
  const id = useId();
  const list = useUnderlays(schemeId, levelId);
  const upload = useUploadUnderlay(schemeId);
  const update = useUpdateUnderlay(schemeId);
  const [localError, setLocalError] = useState<string | null>(null);
  const [calibrating, setCalibrating] = useState<string | null>(null);

  const onFile = (e: ChangeEvent<HTMLInputElement>) => {
    const file = e.target.files?.[0];
    e.target.value = '';
    if (!file) return;
    if (file.size > UNDERLAY_MAX_BYTES) {
      setLocalError(`${file.name} is ${sizeText(file.size)}; the largest file accepted is 10 MB.`);
      return;
    }
    setLocalError(null);
    upload.mutate({ levelId, file });
  };

  const active = list.data?.find((u) => u.id === calibrating) ?? null;

  return (
    <section aria-labelledby={`${id}-title`} className="flex flex-col gap-2">
      <h3 id={`${id}-title`} className="label-caps text-ink">
        Underlays · {levelId}
      </h3>
      {list.isPending ? <Loading label="Loading underlays…" /> : null}
      {list.isError ? <FormAlert>{errorText(list.error)}</FormAlert> : null}
      {list.data && list.data.length === 0 ? (
        <p className="text-sm text-ink-soft">
          No drawing under this level yet.{canEdit ? ' Upload the architect’s plan (PNG, JPEG or PDF) to trace the framing over it.' : ''}
        </p>
      ) : null}
      {list.data && list.data.length > 0 ? (
        <ul className="m-0 list-none p-0">
          {list.data.map((u) => (
            <UnderlayRow
              key={u.id}
              underlay={u}
              schemeId={schemeId}
              canEdit={canEdit}
              units={system}
              onCalibrate={() => setCalibrating(u.id)}
              onPickCalibration={onPickCalibration}
            />
          ))}
        </ul>
      ) : null}
      {canEdit ? (
        <div className="flex flex-col gap-1.5">
          <label htmlFor={`${id}-file`} className="text-sm font-medium text-ink">
            Upload a plan (image or PDF)
          </label>
          <input
            id={`${id}-file`}
            type="file"
            accept={ACCEPT}
            onChange={onFile}
            disabled={upload.isPending}
            aria-describedby={`${id}-file-hint`}
            className="text-sm file:mr-3 file:rounded-[3px] file:border file:border-ink/70 file:bg-paper-raised file:px-3 file:py-1.5 file:text-sm"
          />
          <p id={`${id}-file-hint`} className="text-xs text-ink-faint">
            PNG, JPEG or PDF, up to 10 MB. A PDF shows one page: pick it after uploading. Password-protected PDFs are refused.
          </p>
          {upload.isPending ? <Loading label="Uploading…" /> : null}
          <FormAlert>{localError ?? (upload.isError ? errorText(upload.error) : null)}</FormAlert>
        </div>
      ) : null}
      {active && canEdit && !active.locked ? (
        <UnderlayCalibration
          underlay={active}
          units={system}
          onCancel={() => setCalibrating(null)}
          onSave={async (placement) => {
            await update.mutateAsync({ underlayId: active.id, patch: { placement } });
            setCalibrating(null);
          }}
        />
      ) : null}
    </section>
  );
}

/** A PDF page that could not be drawn says so (an image that fails simply does not show). */
function PictureStatus({ underlay }: { underlay: Underlay }) {
  const picture = useUnderlayPicture(underlay.mime === 'application/pdf' ? underlay : null);
  if (underlay.mime !== 'application/pdf') return null;
  if (picture.error) return <FormAlert>{picture.error}</FormAlert>;
  return picture.url ? (
    <p className="m-0 text-xs text-ink-faint" data-testid="pdf-page-ready">
      Page {underlay.page ?? 1} drawn.
    </p>
  ) : (
    <p className="m-0 text-xs text-ink-faint">Drawing page {underlay.page ?? 1}…</p>
  );
}
