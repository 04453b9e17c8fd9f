// The real server (server/index.ts) as its own OS process, for tests and benchmarks that must
// kill it or measure it from outside: one node process (tsx as an import hook, no wrapper
// process), loopback only, its output kept for failure messages.
import { spawn, type ChildProcess } from 'node:child_process';
import { freePort } from './pg-cluster';

export interface ServerProcess {
  url: string;
  port: number;
  child: ChildProcess;
  /** Everything the process printed so far. */
  output(): string;
  /** Resolves when the process has exited. */
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  kill(signal?: NodeJS.Signals): Promise<void>;
}

export async function startServerProcess(options: {
  databaseUrl: string;
  env?: Record<string, string>;
  port?: number;
  timeoutMs?: number;
  /** Extra node options before the entry (e.g. `--cpu-prof`). */
  nodeArgs?: string[];
  /** Run as `npm start` does: the bundled server (server/launch.mjs) rather than server/index.ts under tsx. */
  bundled?: boolean;
}): Promise<ServerProcess> {
  const port = options.port ?? (await freePort());
  const entry = options.bundled ? ['server/launch.mjs'] : ['--import', 'tsx', 'server/index.ts'];
  const child = spawn(process.execPath, [...(options.nodeArgs ?? []), ...entry], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: String(port),
      DATABASE_URL: options.databaseUrl,
      COOKIE_SECURE: 'false',
      RATE_LIMIT_RELAXED: 'true',
      SEED_DEMO: 'true',
      ...options.env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout!.on('data', (d) => (out += String(d)));
  child.stderr!.on('data', (d) => (out += String(d)));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.once('exit', (code, signal) => resolve({ code, signal })),
  );
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + (options.timeoutMs ?? 90_000);
  let gone = false;
  void exited.then(() => (gone = true));
  for (;;) {
    if (gone) throw new Error(`server exited before answering:\n${out}`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      throw new Error(`server did not answer /api/health in time:\n${out}`);
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    url,
    port,
    child,
    output: () => out,
    exited,
    async kill(signal: NodeJS.Signals = 'SIGKILL') {
      if (!gone) child.kill(signal);
      await exited;
    },
  };
}

/** A minimal cookie-keeping client for one signed-in person. */
export async function signedInClient(url: string, email: string, password: string) {
  const origin = url;
  const res = await fetch(`${url}/api/session`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: origin },
    body: JSON.stringify({ email, password }),
  });
  if (res.status !== 200) throw new Error(`sign-in as ${email} gave ${res.status}: ${await res.text()}`);
  const cookie = res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const call = async (method: string, path: string, body?: unknown) => {
    const r = await fetch(`${url}${path}`, {
      method,
      headers: { Cookie: cookie, Origin: origin, ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await r.text();
    let json: unknown = undefined;
    try {
      json = text ? JSON.parse(text) : undefined;
    } catch {
      json = undefined;
    }
    return { status: r.status, body: json as any, text };
  };
  return { cookie, origin, call };
}
