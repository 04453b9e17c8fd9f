/**
 * The framing of a scheme as an IFC4 model (ISO 16739-1:2018), written with web-ifc.
 *
 * Spatial structure: IfcProject → IfcSite → IfcBuilding → one IfcBuildingStorey per level
 * (Elevation from the level). Each member is an IfcBeam and each column length an IfcColumn,
 * contained in the storey of the level it belongs to (a column length in the storey of the
 * level it supports, at its top), with an IfcExtrudedAreaSolid of an IfcIShapeProfileDef
 * built from the AISC Shapes Database v15.0 dimensions d, bf, tw, tf (no fillet radius:
 * the model is for coordination, not for fabrication detail). Units are SI metres (the
 * IFC default length unit, read the same by every IFC reader); property names carry their
 * own units (kip, ft, in) as Baywright reports them.
 *
 * Property sets are Baywright's own ("Baywright_Member", "Baywright_Column",
 * "Baywright_Caution"); the caution also goes in the file header description.
 */
import { createHash } from 'node:crypto';
import { dirname } from 'node:path';
import { createRequire } from 'node:module';
import * as WebIFC from 'web-ifc';
import type { BuildingColumn, BuildingMember, BuildingModel, IProfile } from '../../shared/drafting/building-model.drafting';

const I = WebIFC.IFC4;
export const FT_TO_M = 0.3048;
export const IN_TO_M = 0.0254;

let apiPromise: Promise<WebIFC.IfcAPI> | null = null;

/** One web-ifc instance per process; its WebAssembly is loaded from the npm package. */
export function ifcApi(): Promise<WebIFC.IfcAPI> {
  if (!apiPromise) {
    apiPromise = (async () => {
      const api = new WebIFC.IfcAPI();
      const dir = dirname(createRequire(import.meta.url).resolve('web-ifc'));
      api.SetWasmPath(`${dir}/`, true);
      await api.Init(undefined, true);
      return api;
    })();
    apiPromise.catch(() => {
      apiPromise = null;
    });
  }
  return apiPromise;
}

const IFC_GUID_CHARS = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz_$';

/**
 * A stable IfcGloballyUniqueId (22 characters of the IFC base-64 alphabet, 128 bits) from a
 * name: the same scheme and element export with the same id, so model updates line up.
 */
export function ifcGuid(name: string): string {
  const bytes = createHash('sha256').update(name).digest().subarray(0, 16);
  let n = 0n;
  for (const b of bytes) n = (n << 8n) | BigInt(b);
  let out = IFC_GUID_CHARS[Number(n >> 126n)];
  for (let shift = 120n; shift >= 0n; shift -= 6n) out += IFC_GUID_CHARS[Number((n >> shift) & 63n)];
  return out;
}

export interface IfcExportInput {
  projectName: string;
  schemeId: string;
  schemeName: string;
  revision: number;
  method: 'LRFD' | 'ASD';
  caution: string;
  model: BuildingModel;
}

type Line = { expressID: number };

/** Writes the model and returns the STEP file bytes (ISO 10303-21). */
export async function writeFramingIfc(input: IfcExportInput): Promise<Uint8Array> {
  const api = await ifcApi();
  const modelId = api.CreateModel({
    schema: WebIFC.Schemas.IFC4,
    name: `${input.schemeName}.ifc`,
    description: ['ViewDefinition [ReferenceView]', input.caution],
    authors: ['Baywright'],
    organizations: ['Baywright'],
    authorization: 'none',
  });
  try {
    const write = <T extends object>(line: T): T & Line => {
      api.WriteLine(modelId, line as never);
      return line as T & Line;
    };
    const label = (s: string) => new I.IfcLabel(s);
    const text = (s: string) => new I.IfcText(s);
    const len = (m: number) => new I.IfcLengthMeasure(m);
    const guid = (what: string) => new I.IfcGloballyUniqueId(ifcGuid(`${input.schemeId}:${what}`));
    const point3 = (x: number, y: number, z: number) => write(new I.IfcCartesianPoint([len(x), len(y), len(z)]));
    const direction = (v: number[]) => write(new I.IfcDirection(v.map((c) => new I.IfcReal(c)) as never));
    const origin = point3(0, 0, 0);
    const placement3 = (loc: Line, axis: Line | null = null, ref: Line | null = null) => write(new I.IfcAxis2Placement3D(loc as never, axis as never, ref as never));
    const localPlacement = (relTo: Line | null, rel: Line) => write(new I.IfcLocalPlacement(relTo as never, rel as never));

    // Units and the geometric context.
    const units = write(
      new I.IfcUnitAssignment([
        write(new I.IfcSIUnit(I.IfcUnitEnum.LENGTHUNIT, null, I.IfcSIUnitName.METRE)),
        write(new I.IfcSIUnit(I.IfcUnitEnum.AREAUNIT, null, I.IfcSIUnitName.SQUARE_METRE)),
        write(new I.IfcSIUnit(I.IfcUnitEnum.VOLUMEUNIT, null, I.IfcSIUnitName.CUBIC_METRE)),
        write(new I.IfcSIUnit(I.IfcUnitEnum.PLANEANGLEUNIT, null, I.IfcSIUnitName.RADIAN)),
      ] as never),
    );
    const worldPlacement = placement3(origin);
    const context = write(new I.IfcGeometricRepresentationContext(null, label('Model'), new I.IfcDimensionCount(3), new I.IfcReal(1e-5) as never, worldPlacement as never, direction([0, 1, 0]) as never));
    const body = write(new I.IfcGeometricRepresentationSubContext(label('Body'), label('Model'), context as never, null, I.IfcGeometricProjectionEnum.MODEL_VIEW, null));

    const project = write(
      new I.IfcProject(guid('project'), null, label(input.projectName), text(`Scheme ${input.schemeName}, revision ${input.revision}, ${input.method}. ${input.caution}`), null, label(input.schemeName), null, [context] as never, units as never),
    );
    const sitePlacement = localPlacement(null, placement3(origin));
    const site = write(new I.IfcSite(guid('site'), null, label('Site'), null, null, sitePlacement as never, null, null, I.IfcElementCompositionEnum.ELEMENT, null, null, null, null, null));
    const buildingPlacement = localPlacement(sitePlacement, placement3(origin));
    const building = write(new I.IfcBuilding(guid('building'), null, label(input.projectName), null, null, buildingPlacement as never, null, null, I.IfcElementCompositionEnum.ELEMENT, null, null, null));
    write(new I.IfcRelAggregates(guid('rel:project-site'), null, null, null, project as never, [site] as never));
    write(new I.IfcRelAggregates(guid('rel:site-building'), null, null, null, site as never, [building] as never));

    const storeys = new Map<string, { line: Line; placement: Line; elevation_m: number; contents: Line[] }>();
    for (const s of input.model.storeys) {
      const elevation_m = s.elevation_ft * FT_TO_M;
      const placement = localPlacement(buildingPlacement, placement3(point3(0, 0, elevation_m)));
      const line = write(
        new I.IfcBuildingStorey(guid(`storey:${s.id}`), null, label(s.name), text(`Level ${s.id}`), null, placement as never, null, label(s.id), I.IfcElementCompositionEnum.ELEMENT, len(elevation_m)),
      );
      storeys.set(s.id, { line, placement, elevation_m, contents: [] });
    }
    if (storeys.size > 0) {
      write(new I.IfcRelAggregates(guid('rel:building-storeys'), null, null, null, building as never, [...storeys.values()].map((s) => s.line) as never));
    }

    // One profile definition per shape, shared by every piece of that size.
    const profiles = new Map<string, Line>();
    const profileFor = (p: IProfile): Line => {
      let line = profiles.get(p.label);
      if (!line) {
        line = write(
          new I.IfcIShapeProfileDef(
            I.IfcProfileTypeEnum.AREA,
            label(p.label),
            null,
            new I.IfcPositiveLengthMeasure(p.bf_in * IN_TO_M),
            new I.IfcPositiveLengthMeasure(p.d_in * IN_TO_M),
            new I.IfcPositiveLengthMeasure(p.tw_in * IN_TO_M),
            new I.IfcPositiveLengthMeasure(p.tf_in * IN_TO_M),
            null,
            null,
            null,
          ),
        );
        profiles.set(p.label, line);
      }
      return line;
    };
    const up = direction([0, 0, 1]);
    const bodyShape = (profile: IProfile, position: Line, length_m: number) => {
      const solid = write(new I.IfcExtrudedAreaSolid(profileFor(profile) as never, position as never, up as never, new I.IfcPositiveLengthMeasure(length_m)));
      const rep = write(new I.IfcShapeRepresentation(body as never, label('Body'), label('SweptSolid'), [solid] as never));
      return write(new I.IfcProductDefinitionShape(null, null, [rep] as never));
    };
    const real = (v: number | null) => (v === null ? null : new I.IfcReal(v));
    const prop = (name: string, value: unknown) => write(new I.IfcPropertySingleValue(new I.IfcIdentifier(name), null, value as never, null));
    const pset = (what: string, name: string, owner: Line, props: Line[]) => {
      const set = write(new I.IfcPropertySet(guid(`pset:${what}`), null, label(name), null, props as never));
      write(new I.IfcRelDefinesByProperties(guid(`rel:pset:${what}`), null, null, null, [owner] as never, set as never));
    };

    for (const m of input.model.members) {
      const storey = storeys.get(m.level);
      if (!storey) continue;
      storey.contents.push(writeMember(m, storey.placement));
    }
    for (const c of input.model.columns) {
      const storey = storeys.get(c.level);
      if (!storey) continue;
      storey.contents.push(writeColumn(c, storey));
    }
    for (const [id, s] of storeys) {
      if (s.contents.length === 0) continue;
      write(new I.IfcRelContainedInSpatialStructure(guid(`rel:contains:${id}`), null, null, null, s.contents as never, s.line as never));
    }
    pset('project-caution', 'Baywright_Caution', project, [prop('Caution', text(input.caution)), prop('DesignMethod', label(input.method)), prop('PlanRevision', new I.IfcInteger(input.revision))]);

    function writeMember(m: BuildingMember, storeyPlacement: Line): Line {
      // Local z along the member, local y up, so the profile's depth is vertical; the
      // profile is lowered by d/2 so the top of steel lies at the level (storey) elevation.
      const dx = (m.end[0] - m.start[0]) / m.length_ft;
      const dy = (m.end[1] - m.start[1]) / m.length_ft;
      const at = placement3(point3(m.start[0] * FT_TO_M, m.start[1] * FT_TO_M, 0), direction([dx, dy, 0]), direction([-dy, dx, 0]));
      const placement = localPlacement(storeyPlacement, at);
      const position = placement3(point3(0, (-m.profile.d_in / 2) * IN_TO_M, 0));
      const shape = bodyShape(m.profile, position, m.length_ft * FT_TO_M);
      const beam = write(
        new I.IfcBeam(guid(`member:${m.id}`), null, label(m.mark || m.id), text(`${m.kind} ${m.mark} ${m.size}`), label(m.size), placement as never, shape as never, new I.IfcIdentifier(m.id), m.kind === 'girder' ? I.IfcBeamTypeEnum.BEAM : I.IfcBeamTypeEnum.JOIST),
      );
      const r = m.reactions;
      pset(`member:${m.id}`, 'Baywright_Member', beam, [
        prop('Mark', label(m.mark)),
        prop('Kind', label(m.kind)),
        prop('Size', label(m.size)),
        prop('Sized', new I.IfcBoolean(m.sized)),
        prop('ProfileDrawn', label(m.profile.label)),
        prop('Level', label(m.level)),
        prop('Span_ft', real(m.length_ft)),
        prop('Ratio', real(m.ratio)),
        prop('Governing', m.governing ? label(m.governing) : null),
        prop('Camber_in', real(m.camber_in)),
        prop('Studs', m.studs === null ? null : new I.IfcInteger(Math.round(m.studs))),
        prop('StartReaction_D_kip', real(r?.start.D_kip ?? null)),
        prop('StartReaction_L_kip', real(r?.start.L_kip ?? null)),
        prop('StartReaction_Lr_kip', real(r?.start.Lr_kip ?? null)),
        prop('StartReaction_S_kip', real(r?.start.S_kip ?? null)),
        prop('StartSupportedBy', r?.start.supportedBy ? label(r.start.supportedBy) : null),
        prop('EndReaction_D_kip', real(r?.end.D_kip ?? null)),
        prop('EndReaction_L_kip', real(r?.end.L_kip ?? null)),
        prop('EndReaction_Lr_kip', real(r?.end.Lr_kip ?? null)),
        prop('EndReaction_S_kip', real(r?.end.S_kip ?? null)),
        prop('EndSupportedBy', r?.end.supportedBy ? label(r.end.supportedBy) : null),
      ]);
      return beam;
    }

    function writeColumn(c: BuildingColumn, storey: { placement: Line; elevation_m: number }): Line {
      // Placed relative to the storey it supports, so its base sits below the storey origin.
      const baseZ = c.baseElevation_ft * FT_TO_M - storey.elevation_m;
      const placement = localPlacement(storey.placement, placement3(point3(c.x_ft * FT_TO_M, c.y_ft * FT_TO_M, baseZ)));
      const shape = bodyShape(c.profile, placement3(origin), c.length_ft * FT_TO_M);
      const column = write(
        new I.IfcColumn(guid(`column:${c.id}`), null, label(c.columnId), text(`column ${c.columnId} below ${c.level}, ${c.size}`), label(c.size), placement as never, shape as never, new I.IfcIdentifier(c.id), I.IfcColumnTypeEnum.COLUMN),
      );
      pset(`column:${c.id}`, 'Baywright_Column', column, [
        prop('Column', label(c.columnId)),
        prop('Size', label(c.size)),
        prop('Sized', new I.IfcBoolean(c.sized)),
        prop('ProfileDrawn', label(c.profile.label)),
        prop('SupportsLevel', label(c.level)),
        prop('BaseElevation_ft', real(c.baseElevation_ft)),
        prop('TopElevation_ft', real(c.topElevation_ft)),
        prop('Length_ft', real(c.length_ft)),
        prop('Pr_kip', real(c.Pr_kip)),
        prop('Ratio', real(c.ratio)),
      ]);
      return column;
    }

    return api.SaveModel(modelId);
  } finally {
    api.CloseModel(modelId);
  }
}
