/**
 * Server benchmarks, in process on a fresh in-memory database with the demo seed: designing the
 * demo scheme through POST /api/schemes/:id/design and reading it back through GET, median of
 * five each (wall and CPU of this process, which runs both the client and the server), and the
 * stored size of a run (packed, design-run-storage.ts) against the plain output. No target.
 */
import { DEMO_SCHEMES } from '../../server/db/seed-demo-building';
import { createTestApp } from '../api/helpers/test-app';

const cpuNow = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

export async function runServerBench(): Promise<void> {
  const t = await createTestApp();
  try {
    const scheme = await t.ctx.db.models.Scheme.findOne({ where: { name: DEMO_SCHEMES[1].name } });
    const id = scheme!.getDataValue('id');
    const timeRequest = async (send: () => Promise<{ status: number; text: string }>) => {
      const wall: number[] = [];
      const cpu: number[] = [];
      let size = 0;
      for (let i = 0; i < 6; i++) {
        const c0 = cpuNow();
        const t0 = performance.now();
        const res = await send();
        if (res.status !== 200) throw new Error(`server bench: status ${res.status}`);
        if (i > 0) {
          // The first request warms the code path.
          wall.push(performance.now() - t0);
          cpu.push(cpuNow() - c0);
        }
        size = res.text.length;
      }
      return { wall: median(wall), cpu: median(cpu), size };
    };
    const post = await timeRequest(() => t.agents.engineer.post(`/api/schemes/${id}/design`));
    const get = await timeRequest(() => t.agents.drafter.get(`/api/schemes/${id}/design`));
    const run = await t.ctx.db.models.DesignRun.findOne({ where: { schemeId: id }, order: [['createdAt', 'DESC']] });
    const raw = run!.getDataValue('result');
    const stored = (typeof raw === 'string' ? raw : JSON.stringify(raw)).length;
    const members = (JSON.parse(get.size > 0 ? (await t.agents.drafter.get(`/api/schemes/${id}/design`)).text : '{}') as { members: unknown[] }).members.length;
    process.stdout.write(
      `server (demo "${DEMO_SCHEMES[1].name}", ${members} members; median of 5 after one warm-up; CPU of client + server in one process):\n` +
        `  POST /api/schemes/:id/design: wall ${post.wall.toFixed(1)} ms, CPU ${post.cpu.toFixed(1)} ms (no target)\n` +
        `  GET /api/schemes/:id/design: wall ${get.wall.toFixed(1)} ms, CPU ${get.cpu.toFixed(1)} ms, ${(get.size / 1e6).toFixed(2)} MB (no target)\n` +
        `  stored run: ${(stored / 1e6).toFixed(2)} MB packed vs ${(get.size / 1e6).toFixed(2)} MB plain output (${((100 * stored) / get.size).toFixed(0)} %), newest ${t.config.designRunsKept} results kept per scheme\n`,
    );
  } finally {
    await t.close();
  }
}
