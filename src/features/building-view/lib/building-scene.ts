// The Building view's scene: every member and column length of a BuildingModel as instanced
// W-shapes (one InstancedMesh per profile and kind of piece, so ten thousand members are a
// few dozen draw calls), coloured per piece, picked by ray, orbited with OrbitControls.
// Frames are drawn on demand (after a change or while the camera moves), not continuously.
import {
  AmbientLight, Box3, BufferGeometry, Color, DirectionalLight, HemisphereLight, InstancedMesh, Matrix4, MeshLambertMaterial,
  PerspectiveCamera, Quaternion, Raycaster, Scene, Vector2, Vector3, WebGLRenderer,
} from 'three';
import { OrbitControls } from 'three/examples/jsm/controls/OrbitControls.js';
import type { BuildingModel, IProfile } from '../../../../shared/drafting/building-model.drafting';
import { iShapeGeometry } from './i-shape-geometry';

/** One drawn piece: a member, or one length of a column (selection uses the plan element id). */
export interface ScenePiece {
  key: string;
  elementId: string;
  level: string;
  kind: 'girder' | 'beam' | 'column';
}

export interface PieceColours {
  /** CSS colour per piece key. */
  colourOf: (key: string) => string;
  selected: string;
}

interface Batch {
  mesh: InstancedMesh;
  pieces: ScenePiece[];
  /** Each piece's placed matrix (kept so hiding a level can restore it). */
  matrices: Matrix4[];
}

const HIDDEN = new Matrix4().makeScale(0, 0, 0);
const Z_UP = new Vector3(0, 0, 1);

export class BuildingScene {
  readonly renderer: WebGLRenderer;
  readonly camera: PerspectiveCamera;
  readonly controls: OrbitControls;
  private readonly scene = new Scene();
  private readonly material = new MeshLambertMaterial({ color: 0xffffff });
  private batches: Batch[] = [];
  private geometries = new Map<string, BufferGeometry>();
  private frameRequested = false;
  private hiddenLevels = new Set<string>();
  private selectedKeys = new Set<string>();
  private colours: PieceColours | null = null;
  private readonly raycaster = new Raycaster();
  private turning = false;
  private frameTimes: number[] = [];
  private lastFrameAt = 0;
  /** Called after each drawn frame with the recent frames per second (while turning) . */
  onFrame: ((stats: { framesPerSecond: number | null; pieces: number }) => void) | null = null;

  constructor(readonly canvas: HTMLCanvasElement, background: string) {
    this.renderer = new WebGLRenderer({ canvas, antialias: true, powerPreference: 'high-performance' });
    this.renderer.setPixelRatio(Math.min(window.devicePixelRatio || 1, 2));
    this.scene.background = new Color(background);
    this.camera = new PerspectiveCamera(40, 1, 0.5, 20000);
    this.camera.up.copy(Z_UP);
    this.controls = new OrbitControls(this.camera, canvas);
    this.controls.enableDamping = false;
    this.controls.addEventListener('change', () => this.requestFrame());
    this.scene.add(new HemisphereLight(0xffffff, 0x8a8170, 1.6));
    this.scene.add(new AmbientLight(0xffffff, 0.35));
    const sun = new DirectionalLight(0xffffff, 1.4);
    sun.position.set(-0.6, -1, 1.4);
    this.scene.add(sun);
    // Ray tests only against instance volumes that are drawn.
    this.raycaster.params.Line = { threshold: 0 };
  }

  setSize(width: number, height: number): void {
    if (width <= 0 || height <= 0) return;
    this.renderer.setSize(width, height, false);
    this.camera.aspect = width / height;
    this.camera.updateProjectionMatrix();
    this.requestFrame();
  }

  /** Replaces what is drawn. Keeps the camera unless `fit`. */
  setModel(model: BuildingModel, colours: PieceColours, fit: boolean): void {
    this.clearBatches();
    this.colours = colours;
    const groups = new Map<string, { profile: IProfile; anchor: 'top' | 'centre'; pieces: ScenePiece[]; matrices: Matrix4[] }>();
    const add = (groupKey: string, profile: IProfile, anchor: 'top' | 'centre', piece: ScenePiece, matrix: Matrix4) => {
      let g = groups.get(groupKey);
      if (!g) groups.set(groupKey, (g = { profile, anchor, pieces: [], matrices: [] }));
      g.pieces.push(piece);
      g.matrices.push(matrix);
    };
    const q = new Quaternion();
    for (const m of model.members) {
      const yaw = Math.atan2(m.end[1] - m.start[1], m.end[0] - m.start[0]);
      q.setFromAxisAngle(Z_UP, yaw);
      const matrix = new Matrix4().compose(new Vector3(m.start[0], m.start[1], m.topElevation_ft), q.clone(), new Vector3(m.length_ft, 1, 1));
      add(`beam:${m.profile.label}`, m.profile, 'top', { key: m.id, elementId: m.id, level: m.level, kind: m.kind }, matrix);
    }
    const up = new Quaternion().setFromAxisAngle(new Vector3(0, 1, 0), -Math.PI / 2); // x → z
    for (const c of model.columns) {
      const matrix = new Matrix4().compose(new Vector3(c.x_ft, c.y_ft, c.baseElevation_ft), up, new Vector3(c.length_ft, 1, 1));
      add(`column:${c.profile.label}`, c.profile, 'centre', { key: c.id, elementId: c.columnId, level: c.level, kind: 'column' }, matrix);
    }
    for (const [groupKey, g] of groups) {
      let geometry = this.geometries.get(groupKey);
      if (!geometry) this.geometries.set(groupKey, (geometry = iShapeGeometry(g.profile, g.anchor)));
      const mesh = new InstancedMesh(geometry, this.material, g.pieces.length);
      mesh.name = groupKey;
      const batch: Batch = { mesh, pieces: g.pieces, matrices: g.matrices };
      this.batches.push(batch);
      this.scene.add(mesh);
    }
    this.refreshInstances();
    if (fit) this.fit();
    this.requestFrame();
  }

  /** Levels whose pieces are not drawn (nor picked). */
  setHiddenLevels(levels: Iterable<string>): void {
    this.hiddenLevels = new Set(levels);
    this.refreshInstances();
    this.requestFrame();
  }

  /** Plan element ids to show as selected. */
  setSelected(elementIds: readonly string[]): void {
    const next = new Set(elementIds);
    const keys = new Set<string>();
    for (const b of this.batches) for (const p of b.pieces) if (next.has(p.elementId)) keys.add(p.key);
    if (keys.size === this.selectedKeys.size && [...keys].every((k) => this.selectedKeys.has(k))) return;
    this.selectedKeys = keys;
    this.refreshColours();
    this.requestFrame();
  }

  /** The piece under a point of the canvas (client px), or null. */
  pick(clientX: number, clientY: number): ScenePiece | null {
    const rect = this.canvas.getBoundingClientRect();
    if (rect.width === 0 || rect.height === 0) return null;
    const ndc = new Vector2(((clientX - rect.left) / rect.width) * 2 - 1, -((clientY - rect.top) / rect.height) * 2 + 1);
    this.raycaster.setFromCamera(ndc, this.camera);
    const meshes = this.batches.map((b) => b.mesh);
    const hit = this.raycaster.intersectObjects(meshes, false).find((h) => h.instanceId !== undefined);
    if (!hit || hit.instanceId === undefined) return null;
    const batch = this.batches.find((b) => b.mesh === hit.object);
    const piece = batch?.pieces[hit.instanceId] ?? null;
    return piece && !this.hiddenLevels.has(piece.level) ? piece : null;
  }

  /** Where a piece's middle lands on the canvas (client px), for tests and labels; null when hidden. */
  screenPointOf(key: string): { x: number; y: number } | null {
    for (const b of this.batches) {
      const i = b.pieces.findIndex((p) => p.key === key);
      if (i < 0) continue;
      if (this.hiddenLevels.has(b.pieces[i].level)) return null;
      const geometry = b.mesh.geometry;
      geometry.computeBoundingBox();
      const centre = geometry.boundingBox!.getCenter(new Vector3()).applyMatrix4(b.matrices[i]).project(this.camera);
      const rect = this.canvas.getBoundingClientRect();
      return { x: rect.left + ((centre.x + 1) / 2) * rect.width, y: rect.top + ((1 - centre.y) / 2) * rect.height };
    }
    return null;
  }

  /** Turns the building slowly about its vertical axis (and measures frames per second). */
  setTurning(on: boolean): void {
    this.turning = on;
    this.controls.autoRotate = on;
    this.controls.autoRotateSpeed = 4;
    this.frameTimes = [];
    this.lastFrameAt = 0;
    this.requestFrame();
  }

  fit(): void {
    const box = new Box3();
    for (const b of this.batches) {
      b.mesh.computeBoundingBox();
      if (b.mesh.boundingBox) box.union(b.mesh.boundingBox);
    }
    if (box.isEmpty()) box.set(new Vector3(0, 0, 0), new Vector3(60, 40, 14));
    const centre = box.getCenter(new Vector3());
    const size = box.getSize(new Vector3()).length() || 50;
    const distance = size / (2 * Math.tan((this.camera.fov * Math.PI) / 360)) * 1.05;
    const direction = new Vector3(-0.9, -1.3, 0.8).normalize();
    this.camera.position.copy(centre).addScaledVector(direction, distance);
    this.camera.near = Math.max(0.1, distance / 500);
    this.camera.far = distance * 20;
    this.camera.updateProjectionMatrix();
    this.controls.target.copy(centre);
    this.controls.update();
    this.requestFrame();
  }

  requestFrame(): void {
    if (this.frameRequested) return;
    this.frameRequested = true;
    requestAnimationFrame(this.frame);
  }

  private readonly frame = (now: number) => {
    this.frameRequested = false;
    if (this.turning) this.controls.update();
    this.renderer.render(this.scene, this.camera);
    let framesPerSecond: number | null = null;
    if (this.turning) {
      if (this.lastFrameAt > 0) this.frameTimes.push(now - this.lastFrameAt);
      this.lastFrameAt = now;
      if (this.frameTimes.length > 60) this.frameTimes.shift();
      if (this.frameTimes.length >= 5) framesPerSecond = 1000 / (this.frameTimes.reduce((s, t) => s + t, 0) / this.frameTimes.length);
      this.requestFrame();
    }
    this.onFrame?.({ framesPerSecond, pieces: this.batches.reduce((s, b) => s + b.pieces.length, 0) });
  };

  private refreshInstances(): void {
    for (const b of this.batches) {
      b.pieces.forEach((p, i) => b.mesh.setMatrixAt(i, this.hiddenLevels.has(p.level) ? HIDDEN : b.matrices[i]));
      b.mesh.instanceMatrix.needsUpdate = true;
      b.mesh.computeBoundingBox();
      b.mesh.computeBoundingSphere();
    }
    this.refreshColours();
  }

  private refreshColours(): void {
    if (!this.colours) return;
    const cache = new Map<string, Color>();
    const colour = (css: string) => {
      let c = cache.get(css);
      if (!c) cache.set(css, (c = new Color(css)));
      return c;
    };
    const selected = colour(this.colours.selected);
    for (const b of this.batches) {
      b.pieces.forEach((p, i) => b.mesh.setColorAt(i, this.selectedKeys.has(p.key) ? selected : colour(this.colours!.colourOf(p.key))));
      if (b.mesh.instanceColor) b.mesh.instanceColor.needsUpdate = true;
    }
  }

  private clearBatches(): void {
    for (const b of this.batches) {
      this.scene.remove(b.mesh);
      b.mesh.dispose();
    }
    this.batches = [];
  }

  dispose(): void {
    this.clearBatches();
    for (const g of this.geometries.values()) g.dispose();
    this.geometries.clear();
    this.material.dispose();
    this.controls.dispose();
    this.renderer.dispose();
  }
}
