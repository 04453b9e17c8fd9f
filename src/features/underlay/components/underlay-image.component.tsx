/**
 * A react-konva node that draws one underlay on the plan canvas; put it on the bottom layer.
 *
 *   <Layer listening={false}>
 *     {underlays.map((u) => <UnderlayImage key={u.id} underlay={u} view={view} />)}
 *   </Layer>
 *
 * underlay: an Underlay from useUnderlays (placement, width_px, height_px, opacity, visible,
 * imageUrl). view: the editor's view { scale (px per ft), x, y } with screen = (x·scale + vx,
 * −y·scale + vy). Draws nothing while the image loads, when it fails, or when not visible.
 * For a plain 2D canvas use drawUnderlay() from lib/underlay-placement.ts instead.
 */
import { useEffect, useState } from 'react';
import { Image as KonvaImage } from 'react-konva';
import type { Underlay } from '../api/underlay.schema';
import { underlayScreenRect, type PlanView } from '../lib/underlay-placement';

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
  const image = useHtmlImage(underlay.visible ? underlay.imageUrl : null);
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
