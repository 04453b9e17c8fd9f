// An I-shape cross-section (bf × d with tw and tf, as in the AISC Shapes Database) extruded
// one foot along +x, for instancing: an instance's matrix stretches x to the member length.
// World units are feet, z up. Beams hang from z = 0 (top of steel at the level); columns are
// centred on their axis. Fillets are left out (drawing, not detailing).
import { ExtrudeGeometry, Shape, type BufferGeometry } from 'three';
import type { IProfile } from '../../../../shared/drafting/building-model.drafting';

export type IShapeAnchor = 'top' | 'centre';

/** The outline in the (width, depth) plane, inches → feet, depth from −d to 0 ('top') or centred. */
export function iShapeOutline(p: IProfile, anchor: IShapeAnchor): [number, number][] {
  const bf = p.bf_in / 12;
  const d = p.d_in / 12;
  const tw = p.tw_in / 12;
  const tf = p.tf_in / 12;
  const y0 = anchor === 'top' ? -d : -d / 2;
  const x = bf / 2;
  const w = tw / 2;
  return [
    [-x, y0], [x, y0], [x, y0 + tf], [w, y0 + tf], [w, y0 + d - tf], [x, y0 + d - tf],
    [x, y0 + d], [-x, y0 + d], [-x, y0 + d - tf], [-w, y0 + d - tf], [-w, y0 + tf], [-x, y0 + tf],
  ];
}

/**
 * The extruded I-shape, 1 ft long along +x. For 'top' (beams): width along y, depth along z
 * (top at z = 0). For 'centre' (columns) the same, centred on the x axis; a column instance
 * turns x up.
 */
export function iShapeGeometry(p: IProfile, anchor: IShapeAnchor): BufferGeometry {
  const shape = new Shape();
  iShapeOutline(p, anchor).forEach(([u, v], i) => (i === 0 ? shape.moveTo(u, v) : shape.lineTo(u, v)));
  shape.closePath();
  const g = new ExtrudeGeometry(shape, { depth: 1, bevelEnabled: false, steps: 1, curveSegments: 1 });
  // Extruded along z with the outline in x (width) and y (depth): turn z → x, then y → z.
  g.rotateY(Math.PI / 2);
  g.rotateX(Math.PI / 2);
  g.computeVertexNormals();
  g.computeBoundingBox();
  g.computeBoundingSphere();
  return g;
}
