import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/db/seed-demo';
import { signedInClient, startServerProcess, type ServerProcess } from '../support/server-process';

// `npm start` runs the server from bundles (server/launch.mjs): the server and its design-run
// worker. The bundled server answers, and a design run goes through the bundled worker thread.

const tmp = mkdtempSync(join(tmpdir(), 'baywright-bundled-'));
let server: ServerProcess | null = null;

afterAll(async () => {
  await server?.kill();
  rmSync(tmp, { recursive: true, force: true });
});

describe('npm start: the bundled server', () => {
  it('when started from its bundle, then it builds the server and worker bundles, signs in and designs the demo scheme in the worker', async () => {
    server = await startServerProcess({ databaseUrl: `sqlite:${join(tmp, 'b.sqlite')}`, env: { UPLOAD_DIR: join(tmp, 'uploads') }, bundled: true, timeoutMs: 180_000 });
    const outDir = join(process.cwd(), 'node_modules/.cache/baywright-server');
    expect(statSync(join(outDir, 'server.mjs')).size).toBeGreaterThan(10_000);
    expect(statSync(join(outDir, 'design.worker.mjs')).size).toBeGreaterThan(10_000);
    const api = await signedInClient(server.url, 'engineer@example.com', DEMO_PASSWORD);
    const projects = await api.call('GET', '/api/projects');
    const schemes = await api.call('GET', `/api/projects/${projects.body.projects[0].id}/schemes`);
    const schemeId = schemes.body.schemes[0].id as string;
    const plan = await api.call('GET', `/api/schemes/${schemeId}/export`);
    const run = await api.call('POST', `/api/schemes/${schemeId}/design`);
    expect(run.status).toBe(200);
    const read = await api.call('GET', `/api/schemes/${schemeId}/design`);
    expect(read.status).toBe(200);
    // Every member of the plan comes back designed (the worker ran the engine from its bundle).
    const designed = read.body.members as { id: string; shape: string | null }[];
    expect(designed.map((m) => m.id).sort()).toEqual((plan.body.members as { id: string }[]).map((m) => m.id).sort());
    expect(designed.every((m) => typeof m.shape === 'string' && /^W\d+X/.test(m.shape))).toBe(true);
    expect(server.output()).not.toContain('could not bundle');
  }, 240_000);
});
