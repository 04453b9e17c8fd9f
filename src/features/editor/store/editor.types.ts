import type { Plan, PlanMember } from '../../../../shared/schemas/plan.schema';

export type PlanPoint = readonly [number, number];

export const TOOL_IDS = [
  'select', 'grid', 'column', 'girder', 'beam', 'infill', 'deck', 'zone',
  'pointLoad', 'lineLoad', 'opening', 'measure', 'delete',
] as const;
export type ToolId = (typeof TOOL_IDS)[number];

/** Screen = world × scale + offset, with plan y pointing up (north) and screen y down. */
export interface View {
  /** Pixels per foot. */
  scale: number;
  /** Screen position of the plan origin, px. */
  x: number;
  y: number;
  /** Canvas size, px. */
  width: number;
  height: number;
}

/** What a tool is in the middle of (not part of the plan, never undone). */
export type Draft =
  | { kind: 'none' }
  | { kind: 'segment'; start: PlanPoint }
  | { kind: 'polygon'; points: PlanPoint[] }
  | { kind: 'rectangle'; start: PlanPoint }
  | { kind: 'box'; start: PlanPoint; end: PlanPoint }
  | { kind: 'measure'; start: PlanPoint; end: PlanPoint | null }
  | { kind: 'dragEnd'; memberId: string; end: 'start' | 'end' };

export interface ToolOptions {
  gridAxis: 'x' | 'y';
  infillDirection: 'auto' | 'x' | 'y';
  infillMode: 'spacing' | 'count';
  infillSpacing_ft: number;
  infillCount: number;
  deckMode: 'bay' | 'polygon';
  deckSpan: 'auto' | 'x' | 'y';
  /** Zone (load area) id that new decks and the Zone tool apply. */
  zoneId: string;
  pointLoad: { D_kip: number; L_kip: number };
  lineLoad: { D_klf: number; L_klf: number };
}

export interface EditorState {
  /** The plan being edited (the local copy; the server's lives in TanStack Query). */
  plan: Plan;
  levelId: string;
  selection: string[];
  tool: ToolId;
  view: View;
  draft: Draft;
  /** Where the pointer is, snapped, in plan feet (null when off the canvas). */
  hover: { point: PlanPoint; snap: string | null } | null;
  options: ToolOptions;
  readOnly: boolean;
  /** A short message from the last action (what it did, or why it could not). */
  notice: EditorNotice | null;
  /** Draw each member's end reactions on the Plan (a view choice, never saved with the plan). */
  showReactions?: boolean;
  /** Bays and framing of a trial option drawn over the plan (never part of the plan, never saved). */
  studyPreview?: StudyPreview | null;
}

export interface StudyPreview {
  levelId: string;
  bays: { x0: number; x1: number; y0: number; y1: number }[];
  /** The option's members in the bays (null: only the bays are shaded). */
  members: PlanMember[] | null;
}

export interface EditorNotice {
  tone: 'info' | 'error';
  text: string;
}

/** What an action returns: the parts of the state it changes. */
export type EditorPatch = Partial<EditorState>;
