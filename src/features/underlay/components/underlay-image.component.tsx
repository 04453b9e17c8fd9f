/**
 * A react-konva node that draws one underlay on the plan canvas; put it on the bottom layer.
 *
 *   <Layer listening={false}>
 *     {underlays.map((u) => <UnderlayImage key={u.id} underlay={u} view={view} />)}
 *   </Layer>
 *
 * underlay: an Underlay from useUnderlays (placement, width_px, height_px, opacity, visible,
 * imageUrl; a PDF's chosen page is rendered in the browser first). view: the editor's view { scale (px per ft), x, y } with screen = (x·scale + vx,
 * −y·scale + vy). Draws nothing while the image loads, when it fails, or when not visible.
 * For a plain 2D canvas use drawUnderlay() from lib/underlay-placement.ts instead.
 */
import { useEffect, useState } from 'react';
import { Image as KonvaImage } from 'react-konva';
import type { Underlay } from '../api/underlay.schema';
import { pdfPageImageUrl } from '../lib/pdf-page-image';
import { underlayScreenRect, type PlanView } from '../lib/underlay-placement';

export interface UnderlayPicture {
  /** What to draw: the image itself, or the rendered PDF page (an object URL); null while it renders. */
  url: string | null;
  /** Why a PDF page could not be drawn. */
  error: string | null;
}

/** The picture of an underlay: its image URL, or its PDF page rendered in the browser. */
export function useUnderlayPicture(underlay: Pick<Underlay, 'mime' | 'imageUrl' | 'page'> | null): UnderlayPicture {
  const isPdf = underlay?.mime === 'application/pdf';
  const fileUrl = underlay?.imageUrl ?? null;
  const page = underlay?.page ?? 1;
  const [state, setState] = useState<{ key: string; url: string | null; error: string | null } | null>(null);
  const key = `${fileUrl}#${page}`;
  useEffect(() => {
    if (!isPdf || !fileUrl) return;
    let live = true;
    pdfPageImageUrl(fileUrl, page).then(
      (url) => live && setState({ key, url, error: null }),
      (error: unknown) => live && setState({ key, url: null, error: error instanceof Error ? error.message : 'The PDF page could not be drawn.' }),
    );
    return () => {
      live = false;
    };
  }, [isPdf, fileUrl, page, key]);
  if (!underlay) return { url: null, error: null };
  if (!isPdf) return { url: underlay.imageUrl, error: null };
  return state?.key === key ? { url: state.url, error: state.error } : { url: null, error: null };
}

/** Loads an image element for a URL (same-origin, with the session cookie). */
export function useHtmlImage(src: string | null): HTMLImageElement | null {
  const [image, setImage] = useState<HTMLImageElement | null>(null);
  useEffect(() => {
    if (!src) return;
    let live = true;
    const img = new window.Image();
    img.onload = () => live && setImage(img);
    img.onerror = () => live && setImage(null);
    img.src = src;
    return () => {
      live = false;
      img.onload = null;
      img.onerror = null;
    };
  }, [src]);
  return src ? image : null;
}

export function UnderlayImage({ underlay, view }: { underlay: Underlay; view: PlanView }) {
  const picture = useUnderlayPicture(underlay.visible ? underlay : null);
  const image = useHtmlImage(picture.url);
  if (!underlay.visible || !image) return null;
  const r = underlayScreenRect(underlay, view);
  return (
    <KonvaImage
      image={image}
      x={r.x}
      y={r.y}
      width={r.width}
      height={r.height}
      rotation={r.rotation}
      opacity={underlay.opacity}
      listening={false}
      perfectDrawEnabled={false}
      name={`underlay-${underlay.id}`}
    />
  );
}
