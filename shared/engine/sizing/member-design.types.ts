import type { LoadCase } from '../loads/combinations';
import type { MemberLoad } from '../analysis/member-load.types';

export type { LoadCase } from '../loads/combinations';
export type { MemberLoad } from '../analysis/member-load.types';

/** "continuous": deck braces the compression flange throughout; "none": supports only. */
export type Bracing = 'continuous' | 'none' | { points_ft: number[] };

export interface MemberDesignInput {
  span_ft: number;
  loads: MemberLoad[];
  bracing: Bracing;
  method: 'LRFD' | 'ASD';
  Fy_ksi: number;
  /** Denominators n of span/n; null skips the check. Total = all load cases together. */
  deflectionLimits: { live: number | null; total: number | null };
  /** Locked shape: checked and reported as is, never replaced. */
  shape?: string | null;
  /** Bounds on the actual depth d. */
  maxDepth_in?: number | null;
  minDepth_in?: number | null;
  /** Allowed nominal depths (series), e.g. [16, 18, 21]. */
  allowedNominalDepths?: number[] | null;
  includeSelfWeight: boolean;
  /** Overrides Lb of every flexure segment (then Cb = 1.0, conservative). */
  Lb_override_ft?: number | null;
  /** LRFD 0.5L permitted (ASCE 7-16 §2.3.1 exception 1); default false. */
  liveLoadFactorHalf?: boolean;
  /**
   * What total deflection includes (design-basis §5, a project setting): all loads (default), or
   * superimposed dead + live, which leaves out self weight and `preCompositeDead` (the slab and
   * deck in place before the concrete hardens; a camber takes them out). Without
   * `preCompositeDead` nothing is left out (the conservative reading).
   */
  totalDeflectionIncludes?: 'deadAndLive' | 'superimposedDeadAndLive';
  preCompositeDead?: MemberLoad[] | null;
  /** Composite design (AISC 360-16 Chapter I); absent = bare steel. */
  composite?: CompositeMemberInput | null;
}

/** calc-interface.md "Additions": the `composite` object of `calc member` input (+ added fields). */
export interface CompositeMemberInput {
  slab: {
    ribHeight_in: number; toppingThickness_in: number; ribAvgWidth_in: number; ribSpacing_in: number;
    concreteWeight_pcf: number; fc_ksi: number; deckWeight_psf: number;
  };
  effectiveWidth_in: number;
  deckOrientation: 'perpendicular' | 'parallel';
  studsPerRib?: number;
  /** Null designs the studs; a count (total on the member) is checked. */
  studs?: number | null;
  shored?: boolean;
  /** Loads on the bare steel before the concrete hardens (wet concrete and deck as D, construction live as L); self weight is added. */
  constructionLoads: MemberLoad[];
  /** Bracing of the bare steel at the construction stage; default: perpendicular deck braces continuously, parallel deck braces only where members frame in (`bracing` of the input unless that is continuous, then none). */
  constructionBracing?: Bracing;
  studDiameter_in?: number;
  studFu_ksi?: number;
  minPercentComposite?: number;
  camber?: boolean;
  /** Steel weight one stud counts as in selection, lb (common practice about 10). */
  studEquivalentWeight_lb?: number;
  /** Distance from mid-height of the deck rib to the stud (I8.2a); null = unknown, Rp = 0.6. */
  emidHt_in?: number | null;
  /** Clause of the effective width and its working, for the report (from the plan framing). */
  effectiveWidthBasis?: string;
}

/** calc-interface.md "Additions": the `composite` object of the output (+ added working). */
export interface CompositeResult {
  studs: number;
  percentComposite: number;
  Qn_kip: number;
  sumQn_kip: number;
  Y2_in: number;
  PNA: 'slab' | 'flange' | 'web';
  Mn_kipft: number;
  Mc_kipft: number;
  Ilb_in4: number;
  deflectionLive_in: number;
  construction: { Mr_kipft: number; Mc_kipft: number; ratio: number; deflection_in: number; Lb_ft: number; Cb: number; combination: string; clause: string; shearRatio: number };
  camber_in: number;
  // working
  effectiveWidth_in: number;
  deckOrientation: 'perpendicular' | 'parallel';
  studsPerRib: number;
  studDiameter_in: number;
  Ec_ksi: number;
  Ac_in2: number;
  a_in: number;
  /** Top of the slab to the top of the steel, hr + tc (the drawn section), in. */
  slabDepth_in: number;
  C_kip: number;
  Cconcrete_kip: number;
  Csteel_kip: number;
  Cgoverns: 'concrete' | 'steel' | 'studs';
  PNA_depth_in: number;
  Rg: number;
  Rp: number;
  RgRpBasis: string;
  QnConcrete_kip: number;
  QnAnchor_kip: number;
  minStuds: number;
  maxStuds: number;
  spacing_in: number;
  spacingLimits_in: { min: number; max: number };
  minPercentComposite: number;
  Yena_in: number;
  shored: boolean;
  camberBasis: string;
  preCompositeDeflection_in: number;
  deflectionTotal_in: number;
  totalDeflectionIncludes: 'deadAndLive' | 'superimposedDeadAndLive';
  /** Studs from each support to the critical section, and that section (concentrated loads). */
  criticalSection_ft: number;
  studsToCriticalSection: number;
  equivalentWeight_lb: number;
  notes: string[];
}

export type CheckName = 'flexure' | 'shear' | 'deflectionLive' | 'deflectionTotal' | 'construction' | 'studs';

/** One check with the working a report prints. Units: kip-ft, kip, in, ksi, ft. */
export interface MemberCheck {
  name: CheckName;
  clause: string;
  equation: string;
  combination: string;
  demand: number;
  capacity: number;
  ratio: number;
  unit: 'kip-ft' | 'kip' | 'in' | 'count';
  limitState?: string;
  method?: 'LRFD' | 'ASD';
  phi?: number;
  omega?: number;
  // flexure
  from_ft?: number;
  to_ft?: number;
  lambda_f?: number;
  lambda_pf?: number;
  lambda_rf?: number;
  flangeClass?: string;
  lambda_w?: number;
  lambda_pw?: number;
  Lp_ft?: number;
  Lr_ft?: number;
  Lb_ft?: number;
  Cb?: number;
  Mp_kipft?: number;
  Mn_kipft?: number;
  Mn_FLB_kipft?: number | null;
  Fcr_ksi?: number | null;
  MA_kipft?: number;
  MB_kipft?: number;
  MC_kipft?: number;
  // shear
  shearCase?: string;
  Aw_in2?: number;
  h_tw?: number;
  h_tw_limit?: number;
  kv?: number | null;
  Cv1?: number;
  Vn_kip?: number;
  // deflection
  limit_n?: number;
  loadCase?: string;
  Ix_in4?: number;
  at_ft?: number;
}

export interface MemberSegment {
  from_ft: number;
  to_ft: number;
  Lb_ft: number;
  Cb: number;
  combination: string;
  Mr_kipft: number;
  Mc_kipft: number;
  Mn_kipft: number;
  ratio: number;
}

export interface CaseReactions { D_kip: number; L_kip: number; Lr_kip: number; S_kip: number }

/** The calc-interface.md `calc member` output plus added fields (none renamed). */
export interface MemberDesignResult {
  shape: string;
  weight_plf: number;
  passes: boolean;
  governing: CheckName;
  /** Governing (highest) ratio over every check. */
  ratio: number;
  Mr_kipft: number;
  Mc_kipft: number;
  Vr_kip: number;
  Vc_kip: number;
  Mp_kipft: number;
  Mn_kipft: number;
  Lp_ft: number;
  Lr_ft: number;
  Lb_ft: number;
  Cb: number;
  deflectionLive_in: number;
  deflectionTotal_in: number;
  ratios: { flexure: number; shear: number; deflectionLive: number | null; deflectionTotal: number | null };
  reactions: { start: CaseReactions; end: CaseReactions };
  checks: MemberCheck[];
  segments: MemberSegment[];
  /** Why nothing passes (or why the locked shape fails); null when it passes. */
  failure: string | null;
  locked: boolean;
  method: 'LRFD' | 'ASD';
  Fy_ksi: number;
  span_ft: number;
  /** Combination of the governing flexure segment. */
  governingCombination: string;
  combinations: { name: string; clause: string }[];
  selfWeight_klf: number;
  maxMoment: { M_kipft: number; x_ft: number };
  standards: string[];
  caution: string;
  /** Present when designed composite (AISC 360-16 Chapter I). */
  composite?: CompositeResult;
}

export interface DiagramSeries {
  label: string;
  V_kip: number[];
  M_kipft: number[];
  deflection_in: number[];
}

export interface MemberDiagrams {
  shape: string;
  x_ft: number[];
  governing: DiagramSeries;
  D: DiagramSeries;
  L: DiagramSeries;
}

export interface AlternativeShape {
  shape: string;
  weight_plf: number;
  d_in: number;
  passes: boolean;
  ratio: number;
  governing: CheckName;
}

export type LoadsByCase = Record<LoadCase, MemberLoad[]>;
