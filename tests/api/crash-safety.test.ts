import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { connectDatabase } from '../../server/db/connection';
import { DEMO_PASSWORD } from '../../server/db/seed-demo';
import { readPlan } from '../../server/services/plan-store.service';
import { dispatch } from '../../src/features/editor/actions/action-registry';
import { savePlan } from '../../src/features/editor/api/save-plan.api';
import { createEditorStore } from '../../src/features/editor/store/editor.store';
import { PlanAutosave } from '../../src/features/editor/sync/plan-autosave';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';
import { signedInClient, startServerProcess, type ServerProcess } from '../support/server-process';
import { testDialect } from './helpers/test-database';

// The real server as its own process on a SQLite file, killed with SIGKILL (no shutdown
// handler runs) while plan saves and a design run are in flight, then reopened: the file
// passes SQLite's integrity check, the last committed revision is whole (revision counter,
// element rows and snapshot agree), nothing half-written is visible, and the Plan's copy kept
// on the device brings back the edit the dead server never stored. SQLite-specific (the
// PostgreSQL pass skips it: PostgreSQL's own crash recovery is not ours to test).

const tmp = mkdtempSync(join(tmpdir(), 'baywright-crash-'));
const dbFile = join(tmp, 'crash.sqlite');
const databaseUrl = `sqlite:${dbFile}`;
let server: ServerProcess | null = null;

afterAll(async () => {
  await server?.kill();
  rmSync(tmp, { recursive: true, force: true });
});

async function start(): Promise<ServerProcess> {
  server = await startServerProcess({ databaseUrl, env: { UPLOAD_DIR: join(tmp, 'uploads') } });
  return server;
}

async function engineer(s: ServerProcess) {
  return signedInClient(s.url, 'engineer@example.com', DEMO_PASSWORD);
}

/** The marker each save writes: the first zone's superimposed dead load (exact in binary). */
const markerOf = (plan: { zones: { superimposedDead_psf: number }[] }) => plan.zones[0].superimposedDead_psf;
const markerFor = (revision: number) => 10 + revision / 8;

interface StoredState {
  integrity: string;
  revision: number;
  snapshots: { revision: number; marker: number }[];
  /** The plan rebuilt from the element rows, and the snapshot of the current revision. */
  fromRows: unknown;
  lastSnapshot: unknown;
  designRuns: { revision: number; members: number; ok: boolean }[];
}

/** Opens the file while no server runs and reads what a restarted server would see. */
async function inspect(schemeId: string): Promise<StoredState> {
  const db = await connectDatabase(databaseUrl);
  try {
    const [check] = await db.sequelize.query<{ integrity_check: string }>('PRAGMA integrity_check', { type: QueryTypes.SELECT });
    const scheme = (await db.models.Scheme.findByPk(schemeId))!.get({ plain: true });
    const revisions = await db.models.PlanRevision.findAll({ where: { schemeId }, order: [['revision', 'ASC']] });
    const snapshots = revisions.map((r) => ({ revision: r.getDataValue('revision'), marker: markerOf(r.getDataValue('plan') as unknown as Plan) }));
    const last = revisions.find((r) => r.getDataValue('revision') === scheme.revision);
    const fromRows = await readPlan(db, scheme);
    const runs = await db.models.DesignRun.findAll({ where: { schemeId } });
    return {
      integrity: check.integrity_check,
      revision: scheme.revision,
      snapshots,
      fromRows: JSON.parse(JSON.stringify(fromRows)),
      lastSnapshot: last?.getDataValue('plan') ?? null,
      designRuns: runs.map((r) => {
        const result = r.getDataValue('result') as { members?: unknown[]; totals?: unknown };
        return { revision: r.getDataValue('revision'), members: result.members?.length ?? -1, ok: Array.isArray(result.members) && typeof result.totals === 'object' };
      }),
    };
  } finally {
    await db.sequelize.close();
  }
}

describe.skipIf(testDialect !== 'sqlite')('crash safety: SIGKILL during plan saves and design runs', () => {
  let schemeId = '';
  let basePlan: Plan;
  const designRunsBefore: number[] = [];

  beforeAll(async () => {
    const s = await start();
    const api = await engineer(s);
    const projects = await api.call('GET', '/api/projects');
    const schemes = await api.call('GET', `/api/projects/${projects.body.projects[0].id}/schemes`);
    schemeId = schemes.body.schemes[0].id;
    const exported = await api.call('GET', `/api/schemes/${schemeId}/export`);
    basePlan = exported.body as Plan;
    designRunsBefore.push((await inspectAfterKill(s)).designRuns.length);
  }, 180_000);

  /** Kills the running server, checks the file, starts it again. */
  async function inspectAfterKill(s: ServerProcess): Promise<StoredState> {
    await s.kill('SIGKILL');
    const state = await inspect(schemeId);
    await start();
    return state;
  }

  it('when the server is killed at several moments of a stream of saves, then every restart finds a whole last revision', async () => {
    // Kill right after the first request is sent, then after 1, 2 and 3 answered saves at
    // moments spread over the next one (its start, a quarter, half and nine tenths of a save's
    // measured time), so the kills land before, inside and at the end of the transaction.
    const savesBeforeKill: number[] = [];
    const moments = [
      { afterSaves: 0, fraction: 0 },
      { afterSaves: 1, fraction: 0.25 },
      { afterSaves: 2, fraction: 0.5 },
      { afterSaves: 3, fraction: 0.9 },
    ];
    for (const { afterSaves, fraction } of moments) {
      const moment = `after ${afterSaves} saves + ${fraction} of one`;
      const api = await engineer(server!);
      const start = (await api.call('GET', `/api/schemes/${schemeId}`)).body.scheme.revision as number;
      const acknowledged: number[] = [];
      const saveMs: number[] = [];
      let sent = start;
      const stream = (async () => {
        for (let revision = start; revision < start + 1000; revision++) {
          const plan = structuredClone(basePlan);
          plan.zones[0].superimposedDead_psf = markerFor(revision + 1);
          sent = revision + 1;
          try {
            const began = performance.now();
            const res = await api.call('PUT', `/api/schemes/${schemeId}/plan`, { revision, plan });
            if (res.status !== 200) throw new Error(`save gave ${res.status}: ${res.text}`);
            saveMs.push(performance.now() - began);
            acknowledged.push(res.body.revision);
          } catch (err) {
            if (err instanceof Error && err.message.startsWith('save gave')) throw err;
            return; // the server is gone
          }
        }
      })();
      let streaming = true;
      void stream.finally(() => (streaming = false)).catch(() => undefined);
      while (streaming && acknowledged.length < afterSaves) await new Promise((r) => setTimeout(r, 2));
      const typicalMs = saveMs.length ? Math.min(...saveMs) : 0;
      await new Promise((r) => setTimeout(r, fraction * typicalMs));
      const state = await inspectAfterKill(server!);
      await stream;

      expect(state.integrity, `kill ${moment}`).toBe('ok');
      savesBeforeKill.push(acknowledged.length);
      const lastAcked = acknowledged.at(-1) ?? start;
      // Every acknowledged save survived; at most the one in flight committed without an answer.
      expect(state.revision).toBeGreaterThanOrEqual(lastAcked);
      expect(state.revision).toBeLessThanOrEqual(sent);
      // No gaps and nothing past the counter: revisions 1..N, each holding the save that made it.
      expect(state.snapshots.map((s) => s.revision)).toEqual(Array.from({ length: state.revision }, (_, i) => i + 1));
      for (const snap of state.snapshots.filter((s) => s.revision > 1)) {
        expect(snap.marker === markerFor(snap.revision) || snap.marker === basePlan.zones[0].superimposedDead_psf).toBe(true);
      }
      expect(state.snapshots.at(-1)!.marker).toBe(state.revision === 1 ? basePlan.zones[0].superimposedDead_psf : markerFor(state.revision));
      // The element rows are exactly the last snapshot: no half-replaced plan.
      expect(state.fromRows).toEqual(state.lastSnapshot);

      // The restarted server serves that revision and takes the next save.
      const after = await engineer(server!);
      const read = await after.call('GET', `/api/schemes/${schemeId}`);
      expect(read.body.scheme.revision).toBe(state.revision);
      expect(markerOf(read.body.scheme.plan)).toBe(state.snapshots.at(-1)!.marker);
    }
    // The kills landed at different points of the stream: before any answer and after several.
    expect(savesBeforeKill[0]).toBe(0);
    expect(savesBeforeKill.slice(1).every((n, i) => n >= i + 1)).toBe(true);
  }, 300_000);

  it('when the server is killed during design runs, then no half-written run is visible and the next run is stored whole', async () => {
    for (const killAfterMs of [5, 120]) {
      const api = await engineer(server!);
      const runs = [api.call('POST', `/api/schemes/${schemeId}/design`).catch(() => null), api.call('POST', `/api/schemes/${schemeId}/design`).catch(() => null)];
      await new Promise((r) => setTimeout(r, killAfterMs));
      const state = await inspectAfterKill(server!);
      await Promise.all(runs);
      expect(state.integrity).toBe('ok');
      for (const run of state.designRuns) {
        expect(run.ok).toBe(true);
        expect(run.members).toBeGreaterThan(0);
        expect(run.revision).toBeLessThanOrEqual(state.revision);
      }
    }
    const api = await engineer(server!);
    const run = await api.call('POST', `/api/schemes/${schemeId}/design`);
    expect(run.status).toBe(200);
    const state = await inspectAfterKill(server!);
    expect(state.designRuns.length).toBeGreaterThan(designRunsBefore[0]);
    expect(state.designRuns.every((r) => r.ok)).toBe(true);
  }, 300_000);

  it('when the server dies before an edit is saved, then the Plan kept on the device recovers it after the restart and saves it', async () => {
    const api = await engineer(server!);
    const realFetch = globalThis.fetch;
    // The browser client's own save call (a same-origin path), sent to the process as this person.
    let session = api;
    globalThis.fetch = ((input: string | URL | Request, init: RequestInit = {}) =>
      typeof input === 'string' && input.startsWith('/')
        ? realFetch(`${server!.url}${input}`, { ...init, headers: { ...(init.headers as Record<string, string>), Cookie: session.cookie, Origin: session.origin } })
        : realFetch(input, init)) as typeof fetch;
    try {
      const storage = new Map<string, string>();
      const deviceStorage = { getItem: (k: string) => storage.get(k) ?? null, setItem: (k: string, v: string) => void storage.set(k, v), removeItem: (k: string) => void storage.delete(k) };
      const loaded = (await api.call('GET', `/api/schemes/${schemeId}`)).body.scheme;
      const store = createEditorStore({ plan: parsePlanFile(loaded.plan).plan! });
      const autosave = new PlanAutosave(store, loaded.revision, {
        save: (revision, plan) => savePlan(schemeId, revision, plan),
        storage: deviceStorage,
        storageKey: `baywright.plan-draft.${schemeId}`,
        debounceMs: 10_000,
        retryMs: 60_000,
      });
      autosave.start();
      const membersBefore = store.getState().plan.members.length;
      dispatch(store, 'member.add', { kind: 'beam', start: [3, 0], end: [3, 12] });
      expect(autosave.snapshot.status).toBe('pending');

      await server!.kill('SIGKILL');
      await autosave.flush(); // the save meets a dead server
      expect(autosave.snapshot.status).toBe('offline');
      autosave.stop();

      // A new page load after the restart: the server has the old plan, the device has the edit.
      await start();
      const api2 = await engineer(server!);
      session = api2;
      const reloaded = (await api2.call('GET', `/api/schemes/${schemeId}`)).body.scheme;
      expect(reloaded.revision).toBe(loaded.revision);
      expect(reloaded.plan.members).toHaveLength(membersBefore);
      const store2 = createEditorStore({ plan: parsePlanFile(reloaded.plan).plan! });
      const autosave2 = new PlanAutosave(store2, reloaded.revision, {
        save: (revision, plan) => savePlan(schemeId, revision, plan),
        storage: deviceStorage,
        storageKey: `baywright.plan-draft.${schemeId}`,
      });
      const draft = autosave2.readLocalDraft();
      expect(draft).not.toBeNull();
      expect(draft!.baseRevision).toBe(loaded.revision);
      expect(draft!.plan.members).toHaveLength(membersBefore + 1);
      expect(draft!.plan.members.at(-1)).toMatchObject({ kind: 'beam', start: [3, 0], end: [3, 12] });

      // "Restore" puts the draft back in the Plan; the next save stores it.
      autosave2.start();
      store2.setState({ plan: draft!.plan });
      await autosave2.flush();
      expect(autosave2.snapshot).toMatchObject({ status: 'saved', revision: loaded.revision + 1 });
      const saved = (await api2.call('GET', `/api/schemes/${schemeId}`)).body.scheme;
      expect(saved.plan.members).toHaveLength(membersBefore + 1);
      expect(storage.size).toBe(0);
      autosave2.stop();
    } finally {
      globalThis.fetch = realFetch;
    }
  }, 180_000);
});
