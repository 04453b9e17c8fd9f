// The second half of `npm test`: the API suite on PostgreSQL (test:api:pg) and the browser
// tests (test:e2e) side by side. Playwright runs one browser at a time and leaves a core idle
// most of the time; the PostgreSQL pass (one vitest worker) uses it. The PostgreSQL pass's
// output is held and printed whole when it ends, so the two logs do not interleave. Exits
// non-zero when either fails.
import { spawn } from 'node:child_process';

function run(name: string, args: string[], hold: boolean): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn('npm', ['run', '-s', ...args], { stdio: hold ? ['ignore', 'pipe', 'pipe'] : 'inherit', env: process.env });
    const chunks: Buffer[] = [];
    if (hold) {
      child.stdout!.on('data', (c: Buffer) => chunks.push(c));
      child.stderr!.on('data', (c: Buffer) => chunks.push(c));
    }
    child.on('exit', (code, signal) => {
      if (hold) process.stdout.write(`\n──── ${name} ────\n${Buffer.concat(chunks).toString('utf8')}\n──── end of ${name} ────\n`);
      const status = code ?? (signal ? 1 : 0);
      console.log(`${name}: ${status === 0 ? 'passed' : `FAILED (exit ${status})`}`);
      resolve(status);
    });
    for (const sig of ['SIGINT', 'SIGTERM'] as const) process.on(sig, () => child.kill(sig));
  });
}

const [pg, e2e] = await Promise.all([
  run('API suite on PostgreSQL', ['test:api:pg', '--', '--maxWorkers', '1'], true),
  run('browser tests', ['test:e2e'], false),
]);
process.exit(pg !== 0 || e2e !== 0 ? 1 : 0);
