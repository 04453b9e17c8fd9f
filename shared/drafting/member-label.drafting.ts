/**
 * The size label drafters write on framing plans for a composite member: the shape, the total
 * number of shear studs in parentheses, and the camber, e.g. `W18X35 (20) c=3/4"` (a trade
 * convention; this layout is Baywright's own). Bare members show the shape alone.
 */
import { camberText } from '../engine/design/serviceability/camber.serviceability';

export function memberSizeLabel(shape: string | null, studs?: number | null, camber_in?: number | null): string {
  if (!shape) return 'NOT SIZED';
  let out = shape;
  if (typeof studs === 'number' && studs > 0) out += ` (${studs})`;
  if (typeof camber_in === 'number' && camber_in > 0) out += ` c=${camberText(camber_in)}`;
  return out;
}
