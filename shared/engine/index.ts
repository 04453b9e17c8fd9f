// Public entry of the Baywright calculation engine (pure TypeScript). A plain list of exports.
export type { LoadCase, LoadCombination, LoadFactors } from './loads/combinations';
export { LOAD_CASES, loadCombinations, sharedLoadCombinations } from './loads/combinations';
export type { MemberLoad } from './analysis/member-load.types';
export type {
  AlternativeShape, Bracing, CaseReactions, CheckName, DiagramSeries, MemberCheck, MemberDesignInput,
  MemberDesignResult, MemberDiagrams, MemberSegment,
} from './sizing/member-design.types';
export { designMember, memberAlternatives, candidateShapes } from './sizing/member-design';
export { memberDiagrams } from './sizing/member-diagrams';
export { MemberInputError, memberInputProblems, formatProblem, formatProblemPath } from './sizing/member-input.validation';
export type { InputProblem } from './sizing/member-input.validation';
export { STANDARDS, CAUTION } from './sizing/member-result.builder';
export {
  maxMomentKipFt, maxShearKip, reactionsKip, momentKipFt, shearKip, deflectionEIKipFt3, toSpanLoading, stations,
} from './analysis/simple-span.analysis';
export type { SpanLoading, Station } from './analysis/simple-span.analysis';
export { computeWShapeConstants, shapeConstantsFor, shapeConstantsByWeight, nominalFlexure } from './design/aisc360/w-shape-constants';
export type { WShapeConstants, NominalFlexure } from './design/aisc360/w-shape-constants';
export { E_KSI } from './units/units.constants';
// Plans: framing topology, gravity takedown, whole-scheme design (plan helper).
export { SUPPORT_TOLERANCE_FT, buildFramingTopology, orderBySupport } from './geometry/framing-topology.geometry';
export type { FramingTopology, FramingMember, EndSupport } from './geometry/framing-topology.geometry';
export { computeDeckTributary } from './loads/deck-tributary.loads';
export { slabWeight } from './loads/slab-weight.loads';
export type { SlabBuildUp } from './loads/slab-weight.loads';
export { deckOverlapProblems, polygonOverlapAreaFt2 } from './geometry/polygon-overlap.geometry';
export { eq4_7_1Factor, liveLoadReductionFactor, kllTable4_7_1 } from './loads/live-load-reduction.loads';
export { runTakedown } from './takedown/gravity-takedown.takedown';
export type { TakedownResult, MemberTakedown, EndReaction } from './takedown/gravity-takedown.takedown';
export { designScheme, SCHEME_CAUTION } from './scheme/design-scheme.scheme';
export type { SchemeResult, SchemeMember, SchemeOptions } from './scheme/design-scheme.scheme';
export { memberBracingSource, memberDeflectionLimits } from './scheme/member-settings.scheme';
export type { BracingUsed, DeflectionLimitsUsed, SettingSource } from './scheme/member-settings.scheme';
// Layout and bay study: the Infill tool's rules and framing options for bays (calc study).
export { findBay, bayPolygon, infillBay, infillDirection, applyInfill } from './layout/bay-infill.layout';
export type { Bay, InfillRequest, InfillResult } from './layout/bay-infill.layout';
export { runStudy, studyOptionSpecs, schemeStudyFigures, markBest, StudyInputError, STUDY_BASIS } from './study/run-study.study';
export type { StudyResult, StudyOptionResult, StudyFigures, StudyHooks } from './study/run-study.study';
export { applyStudyOption } from './study/apply-option.study';
export type { StudyOptionSpec, AppliedOption } from './study/apply-option.study';
export { levelBays, regionBays, memberInBays, baysAreaFt2 } from './study/study-region.study';
export { columnWorking, columnCombinations } from './sizing/column-working';
export type { ColumnWorking, ColumnWorkingTier, ColumnWorkingLength, ColumnLighterTry, ColumnWorkingInput } from './sizing/column-working';
export type { SchemeColumn, SchemeColumnLevel, SchemeColumnTier } from './scheme/column-design.scheme';
export { DEFAULT_COLUMN_SERIES } from './sizing/column-design';
export { DEFAULT_STOREYS_PER_TIER } from './sizing/column-tiers';
