import * as WebIFC from 'web-ifc';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findWShape } from '../../shared/catalog/w-shapes.catalog';
import { ifcApi, ifcGuid } from '../../server/ifc/framing-model.ifc';
import { createProject } from '../../server/services/projects.service';
import { designSchemeNow } from '../../server/services/scheme-design.service';
import { createScheme } from '../../server/services/schemes.service';
import { makeScheme, twoBayPlan } from './helpers/schemes-fixture';
import { createTestApp, type TestApp } from './helpers/test-app';

// GET /api/schemes/:id/model.ifc: the framing as IFC4 (ISO 16739-1:2018), read back with web-ifc.

const M_PER_FT = 0.3048; // NIST SP 811 B.8 (exact)
const M_PER_IN = 0.0254; // NIST SP 811 B.8 (exact)

let t: TestApp;
let api: WebIFC.IfcAPI;
beforeAll(async () => {
  t = await createTestApp();
  api = await ifcApi();
});
afterAll(async () => {
  expect(t.serverErrors).toEqual([]);
  await t.close();
});

/** The two-bay fixture with a second framed level (L3 at 27 ft) and columns carrying both. */
function twoLevelPlan() {
  const plan = twoBayPlan() as {
    levels: { id: string; name: string; elevation_ft: number }[];
    columns: { id: string; levels: string[] }[];
    members: { id: string; level: string }[];
    decks: { id: string; level: string }[];
    pointLoads: unknown[];
    lineLoads: unknown[];
    openings: unknown[];
  };
  plan.levels.push({ id: 'L3', name: 'Level 3', elevation_ft: 27 });
  for (const c of plan.columns) c.levels = ['L2', 'L3'];
  plan.members.push(...plan.members.map((m) => ({ ...m, id: `${m.id}-3`, level: 'L3' })));
  plan.decks.push(...plan.decks.map((d) => ({ ...d, id: `${d.id}-3`, level: 'L3' })));
  return plan;
}

async function download(agent: TestApp['agents']['drafter'], schemeId: string) {
  return agent
    .get(`/api/schemes/${schemeId}/model.ifc`)
    .buffer(true)
    .parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on('data', (c: Buffer) => parts.push(c));
      r.on('end', () => cb(null, Buffer.concat(parts)));
    });
}

type Line = Record<string, any>; // eslint-disable-line @typescript-eslint/no-explicit-any
const val = (v: { value?: unknown; _representationValue?: unknown } | null | undefined) => (v == null ? null : (v._representationValue ?? v.value ?? null));

/** Every product's storey, profile, extrusion length and property set, as read from the file. */
function readBack(bytes: Uint8Array) {
  const id = api.OpenModel(bytes);
  try {
    const line = (n: number): Line => api.GetLine(id, n, true);
    const all = (type: number) => {
      const v = api.GetLineIDsWithType(id, type);
      return Array.from({ length: v.size() }, (_, i) => v.get(i));
    };
    const storeyOf = new Map<number, { name: string; elevation_m: number }>();
    for (const rel of all(WebIFC.IFCRELCONTAINEDINSPATIALSTRUCTURE).map(line)) {
      const s = rel.RelatingStructure;
      for (const e of rel.RelatedElements) storeyOf.set(e.expressID, { name: val(s.LongName) as string, elevation_m: val(s.Elevation) as number });
    }
    const props = new Map<number, Record<string, unknown>>();
    for (const rel of all(WebIFC.IFCRELDEFINESBYPROPERTIES).map(line)) {
      const set = rel.RelatingPropertyDefinition;
      const values = Object.fromEntries(set.HasProperties.map((p: Line) => [val(p.Name), val(p.NominalValue)]));
      for (const o of rel.RelatedObjects) props.set(o.expressID, { pset: val(set.Name), ...values });
    }
    const products = (type: number) =>
      all(type).map((n) => {
        const p = line(n);
        const solid = p.Representation.Representations[0].Items[0];
        const prof = solid.SweptArea;
        return {
          tag: val(p.Tag) as string,
          name: val(p.Name) as string,
          storey: storeyOf.get(n) ?? null,
          length_ft: (val(solid.Depth) as number) / M_PER_FT,
          profile: {
            type: prof.type,
            name: val(prof.ProfileName) as string,
            d_in: (val(prof.OverallDepth) as number) / M_PER_IN,
            bf_in: (val(prof.OverallWidth) as number) / M_PER_IN,
            tw_in: (val(prof.WebThickness) as number) / M_PER_IN,
            tf_in: (val(prof.FlangeThickness) as number) / M_PER_IN,
          },
          props: props.get(n) ?? {},
          placement: p.ObjectPlacement,
        };
      });
    const project = line(all(WebIFC.IFCPROJECT)[0]);
    const schema = api.GetModelSchema(id);
    return { beams: products(WebIFC.IFCBEAM), columns: products(WebIFC.IFCCOLUMN), storeys: all(WebIFC.IFCBUILDINGSTOREY).map(line), project, schema, sites: all(WebIFC.IFCSITE).length, buildings: all(WebIFC.IFCBUILDING).length };
  } finally {
    api.CloseModel(id);
  }
}

describe('GET /api/schemes/:id/model.ifc', () => {
  let schemeId: string;
  let design: { members: { id: string; mark: string; level: string; shape: string; span_ft: number; reactions: { start: { D_kip: number }; end: { L_kip: number } } }[] };
  let model: ReturnType<typeof readBack>;
  let res: Awaited<ReturnType<typeof download>>;

  beforeAll(async () => {
    const actor = { firmId: t.seed.firmId!, userId: t.seed.userIds.engineer! };
    const project = await createProject(t.ctx.db, actor, { name: 'Model export project' });
    const scheme = await createScheme({ db: t.ctx.db, actor }, project.id, { name: 'Scheme C two levels', plan: twoLevelPlan() });
    schemeId = scheme.id;
    design = (await designSchemeNow({ db: t.ctx.db, actor }, schemeId)) as unknown as typeof design;
    res = await download(t.agents.drafter, schemeId);
    model = readBack(new Uint8Array(res.body as Buffer));
  });

  it('when a drafter downloads it, then it is an IFC4 STEP file named after the scheme with the caution in its header', () => {
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toBe('attachment; filename="scheme-c-two-levels-r1.ifc"');
    expect(res.headers['x-baywright-caution']).toContain('licensed engineer');
    const text = (res.body as Buffer).toString('latin1');
    expect(text.startsWith('ISO-10303-21;')).toBe(true);
    expect(text).toContain("FILE_SCHEMA(('IFC4'));");
    expect(text).toMatch(/FILE_DESCRIPTION\(\('ViewDefinition \[ReferenceView\]','Baywright results must be checked by a licensed engineer/);
    expect(model.schema).toBe('IFC4');
    // ISO 10303-21 FILE_NAME: preprocessor web-ifc, originating system Baywright; no banner comment.
    const header = text.slice(0, text.indexOf('DATA;'));
    expect(header).toMatch(/FILE_NAME\('Scheme C two levels\.ifc','[^']+',\('Baywright'\),\('Baywright'\),'web-ifc','Baywright','none'\);/);
    expect(header).not.toContain('/*');
  });

  it('when read back, then there is one project, site and building and a storey per level at its elevation', () => {
    expect(val(model.project.Name)).toBe('Model export project');
    expect(model.sites).toBe(1);
    expect(model.buildings).toBe(1);
    const storeys = model.storeys.map((s) => ({ level: val(s.LongName), name: val(s.Name), elevation_ft: (val(s.Elevation) as number) / M_PER_FT }));
    expect(storeys.map((s) => s.level)).toEqual(['L2', 'L3']);
    expect(storeys[0].name).toBe('Level 2');
    expect(storeys[0].elevation_ft).toBeCloseTo(14, 6);
    expect(storeys[1].elevation_ft).toBeCloseTo(27, 6);
  });

  it('when read back, then every designed member is an IfcBeam with its I-shape profile from the catalog, its length within 0.01 ft and its storey', () => {
    expect(design.members).toHaveLength(22);
    expect(model.beams).toHaveLength(design.members.length);
    for (const m of design.members) {
      const beam = model.beams.find((b) => b.tag === m.id)!;
      expect(beam, m.id).toBeDefined();
      expect(beam.name).toBe(m.mark);
      expect(beam.storey?.name).toBe(m.level);
      expect(Math.abs(beam.length_ft - m.span_ft)).toBeLessThan(0.01);
      const shape = findWShape(m.shape)!; // AISC Shapes Database v15.0 dimensions
      expect(beam.profile.type).toBe(WebIFC.IFCISHAPEPROFILEDEF);
      expect(beam.profile.name).toBe(m.shape);
      expect(beam.profile.d_in).toBeCloseTo(shape.d_in, 6);
      expect(beam.profile.bf_in).toBeCloseTo(shape.bf_in, 6);
      expect(beam.profile.tw_in).toBeCloseTo(shape.tw_in, 6);
      expect(beam.profile.tf_in).toBeCloseTo(shape.tf_in, 6);
      expect(beam.props).toMatchObject({ pset: 'Baywright_Member', Mark: m.mark, Size: m.shape, Sized: true, Level: m.level });
      expect(beam.props.StartReaction_D_kip as number).toBeCloseTo(m.reactions.start.D_kip, 9);
      expect(beam.props.EndReaction_L_kip as number).toBeCloseTo(m.reactions.end.L_kip, 9);
      // Composite design does not report camber or studs yet: present, and empty.
      expect(beam.props).toHaveProperty('Camber_in', null);
      expect(beam.props).toHaveProperty('Studs', null);
    }
  });

  it('when read back, then a 30 ft member has its top of steel at its level: placed on the storey, profile lowered by d/2, running along x', () => {
    const m = design.members.find((x) => x.id === 'gA23-3')!;
    const beam = model.beams.find((b) => b.tag === 'gA23-3')!;
    const rel = beam.placement.RelativePlacement;
    expect(val(rel.Location.Coordinates[0]) as number).toBeCloseTo(30 * M_PER_FT, 9); // starts at (30, 0)
    expect(rel.Axis.DirectionRatios.map(val)).toEqual([1, 0, 0]);
    // The storey placement the member is relative to sits at the level's elevation.
    const storeyZ = val(beam.placement.PlacementRelTo.RelativePlacement.Location.Coordinates[2]) as number;
    expect(storeyZ / M_PER_FT).toBeCloseTo(27, 6);
    expect(m.span_ft).toBeCloseTo(30, 9);
  });

  it('when read back, then each column length is an IfcColumn from the level below (or 0 ft) to its level, with the size the design gave that length', () => {
    expect(model.columns).toHaveLength(12);
    const lower = model.columns.find((c) => c.tag === 'C-B2@L2')!;
    const upper = model.columns.find((c) => c.tag === 'C-B2@L3')!;
    expect(lower.storey?.name).toBe('L2');
    expect(upper.storey?.name).toBe('L3');
    expect(Math.abs(lower.length_ft - 14)).toBeLessThan(0.01); // L2 at 14 ft down to elevation 0
    expect(Math.abs(upper.length_ft - 13)).toBeLessThan(0.01); // 27 − 14
    const designed = (design as unknown as { columns: { id: string; levels: { level: string; shape: string | null }[] }[] }).columns
      .find((c) => c.id === 'C-B2')!.levels.find((l) => l.level === 'L2')!.shape!;
    expect(designed).toMatch(/^W1[024]X\d+$/); // sized from the allowed series (issue 12)
    expect(lower.props).toMatchObject({ pset: 'Baywright_Column', Column: 'C-B2', Size: designed, Sized: true, ProfileDrawn: designed, SupportsLevel: 'L2' });
    expect(lower.props.BaseElevation_ft).toBe(0);
    expect(upper.props.BaseElevation_ft).toBe(14);
    expect(lower.profile.d_in).toBeCloseTo(findWShape(designed)!.d_in, 6);
  });

  it('when the same scheme is exported twice, then element ids are the same (stable GlobalIds)', async () => {
    const again = readBack(new Uint8Array((await download(t.agents.manager, schemeId)).body as Buffer));
    expect(again.beams.map((b) => b.tag).sort()).toEqual(model.beams.map((b) => b.tag).sort());
    expect(ifcGuid('a')).toHaveLength(22);
    expect(ifcGuid('a')).toBe(ifcGuid('a'));
    expect(ifcGuid('a')).not.toBe(ifcGuid('b'));
  });
});

/** World-space bounding box (ft) of one product's triangulated geometry, as web-ifc computes it. */
function worldBox(bytes: Uint8Array, tag: string): { min: number[]; max: number[] } {
  const id = api.OpenModel(bytes);
  try {
    const ids = [...[WebIFC.IFCBEAM, WebIFC.IFCCOLUMN].flatMap((type) => {
      const v = api.GetLineIDsWithType(id, type);
      return Array.from({ length: v.size() }, (_, i) => v.get(i));
    })];
    const express = ids.find((n) => val(api.GetLine(id, n).Tag) === tag)!;
    const mesh = api.GetFlatMesh(id, express);
    const min = [Infinity, Infinity, Infinity];
    const max = [-Infinity, -Infinity, -Infinity];
    for (let g = 0; g < mesh.geometries.size(); g++) {
      const placed = mesh.geometries.get(g);
      const geometry = api.GetGeometry(id, placed.geometryExpressID);
      const verts = api.GetVertexArray(geometry.GetVertexData(), geometry.GetVertexDataSize());
      const m = placed.flatTransformation; // column-major 4 × 4
      for (let i = 0; i < verts.length; i += 6) {
        const [x, y, z] = [verts[i], verts[i + 1], verts[i + 2]];
        const w = [m[0] * x + m[4] * y + m[8] * z + m[12], m[1] * x + m[5] * y + m[9] * z + m[13], m[2] * x + m[6] * y + m[10] * z + m[14]];
        // web-ifc hands geometry back y-up (x, z, −y in IFC terms): swap to plan x, y and elevation z.
        const plan = [w[0], -w[2], w[1]].map((c) => c / M_PER_FT);
        plan.forEach((c, k) => ((min[k] = Math.min(min[k], c)), (max[k] = Math.max(max[k], c))));
      }
      geometry.delete();
    }
    return { min, max };
  } finally {
    api.CloseModel(id);
  }
}

describe('GET /api/schemes/:id/model.ifc: geometry as an IFC reader draws it', () => {
  it('when web-ifc triangulates a girder and a column, then they sit where the plan puts them: top of steel at the level, column from 14 ft to 27 ft', async () => {
    const actor = { firmId: t.seed.firmId!, userId: t.seed.userIds.engineer! };
    const project = await createProject(t.ctx.db, actor, { name: 'Geometry project' });
    const scheme = await createScheme({ db: t.ctx.db, actor }, project.id, { name: 'Geometry', plan: twoLevelPlan() });
    const design = (await designSchemeNow({ db: t.ctx.db, actor }, scheme.id)) as unknown as { members: { id: string; shape: string }[] };
    const bytes = new Uint8Array((await download(t.agents.drafter, scheme.id)).body as Buffer);
    const girder = worldBox(bytes, 'gA23-3'); // plan (30, 0) → (60, 0) at L3, 27 ft
    const d_ft = findWShape(design.members.find((m) => m.id === 'gA23-3')!.shape)!.d_in / 12;
    expect(girder.min[0]).toBeCloseTo(30, 2);
    expect(girder.max[0]).toBeCloseTo(60, 2);
    expect(girder.max[2]).toBeCloseTo(27, 2); // top of steel at the level
    expect(girder.min[2]).toBeCloseTo(27 - d_ft, 2);
    const beam = worldBox(bytes, 'b2'); // plan (10, 0) → (10, 36) at L2, 14 ft
    expect(beam.min[1]).toBeCloseTo(0, 2);
    expect(beam.max[1]).toBeCloseTo(36, 2);
    expect(beam.max[2]).toBeCloseTo(14, 2);
    const column = worldBox(bytes, 'C-B2@L3'); // at (30, 36)
    expect(column.min[2]).toBeCloseTo(14, 2);
    expect(column.max[2]).toBeCloseTo(27, 2);
    expect((column.min[0] + column.max[0]) / 2).toBeCloseTo(30, 2);
    expect((column.min[1] + column.max[1]) / 2).toBeCloseTo(36, 2);
  });
});

describe('GET /api/schemes/:id/model.ifc: refusals', () => {
  it('when the scheme has never been designed, then 409 not_designed says to design it first', async () => {
    const { schemeId } = await makeScheme(t);
    const res = await t.agents.drafter.get(`/api/schemes/${schemeId}/model.ifc`);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatchObject({ code: 'not_designed', message: expect.stringContaining('never been designed') });
    expect(await t.ctx.db.models.DesignRun.count({ where: { schemeId } })).toBe(0);
  });

  it('when the design is older than the plan, then the scheme is designed again first and the export follows the plan', async () => {
    const { schemeId } = await makeScheme(t, { designed: true });
    const scheme = await t.ctx.db.models.Scheme.findByPk(schemeId);
    const plan = (await t.agents.engineer.get(`/api/schemes/${schemeId}/export`)).body;
    plan.members = plan.members.filter((m: { id: string }) => m.id !== 'b3');
    const saved = await t.agents.engineer.put(`/api/schemes/${schemeId}/plan`).send({ revision: scheme!.getDataValue('revision'), plan });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    const res = await download(t.agents.drafter, schemeId);
    expect(res.status).toBe(200);
    const back = readBack(new Uint8Array(res.body as Buffer));
    expect(back.beams.map((b) => b.tag)).not.toContain('b3');
    expect(back.beams).toHaveLength(10);
  });

  it('when the scheme has no members or columns, then 422 empty_model names the members', async () => {
    const actor = { firmId: t.seed.firmId!, userId: t.seed.userIds.engineer! };
    const project = await createProject(t.ctx.db, actor, { name: 'Empty model project' });
    const plan = { ...twoBayPlan(), columns: [], members: [], decks: [], pointLoads: [], lineLoads: [], openings: [] };
    const scheme = await createScheme({ db: t.ctx.db, actor }, project.id, { name: 'Empty', plan });
    await designSchemeNow({ db: t.ctx.db, actor }, scheme.id);
    const res = await t.agents.drafter.get(`/api/schemes/${scheme.id}/model.ifc`);
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('empty_model');
    expect(res.body.error.fields.members).toBeDefined();
  });

  it('when the id is not a scheme id, or another firm asks, then 400 or 404, never 500', async () => {
    expect((await t.agents.drafter.get('/api/schemes/not-a-uuid/model.ifc')).status).toBe(400);
    const { schemeId } = await makeScheme(t, { designed: true });
    expect((await t.otherOwner.get(`/api/schemes/${schemeId}/model.ifc`)).status).toBe(404);
  });
});
