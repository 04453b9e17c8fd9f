// A throw-away local PostgreSQL cluster for tests: initdb into a temp folder, start on a free
// loopback port, stop and delete at the end. Uses the distribution's server binaries (initdb,
// pg_ctl) from PATH or /usr/lib/postgresql/<major>/bin. initdb refuses to run as root, so as
// root everything runs as the `postgres` system user (Debian's package creates it).
import { execFileSync, spawnSync } from 'node:child_process';
import { chmodSync, chownSync, existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface PgCluster {
  /** postgres://postgres@127.0.0.1:<port>/postgres (trust auth, loopback only). */
  adminUrl: string;
  port: number;
  dataDir: string;
  stop(): void;
}

function onPath(name: string): string | null {
  const r = spawnSync('sh', ['-c', `command -v ${name}`], { encoding: 'utf8' });
  return r.status === 0 ? r.stdout.trim() : null;
}

/** The folder holding initdb and pg_ctl, or null when PostgreSQL's server is not installed. */
export function findPgBinDir(): string | null {
  const fromEnv = process.env.PG_BIN_DIR;
  if (fromEnv && existsSync(join(fromEnv, 'initdb'))) return fromEnv;
  const base = '/usr/lib/postgresql';
  if (existsSync(base)) {
    const majors = readdirSync(base)
      .filter((d) => /^\d+$/.test(d) && existsSync(join(base, d, 'bin', 'initdb')))
      .sort((a, b) => Number(b) - Number(a));
    if (majors.length) return join(base, majors[0], 'bin');
  }
  const initdb = onPath('initdb');
  return initdb && onPath('pg_ctl') ? initdb.replace(/\/initdb$/, '') : null;
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

const isRoot = () => process.getuid?.() === 0;

/** Runs a PostgreSQL binary as the postgres user when we are root, else as ourselves. */
function runPg(binDir: string, bin: string, args: string[]): void {
  const exe = join(binDir, bin);
  const [cmd, argv] = isRoot() ? ['runuser', ['-u', 'postgres', '--', exe, ...args]] : [exe, args];
  execFileSync(cmd, argv, { stdio: ['ignore', 'pipe', 'pipe'], cwd: tmpdir() });
}

export async function startPgCluster(binDir: string): Promise<PgCluster> {
  const dataDir = mkdtempSync(join(tmpdir(), 'baywright-pg-'));
  if (isRoot()) {
    const uid = spawnSync('id', ['-u', 'postgres'], { encoding: 'utf8' });
    const gid = spawnSync('id', ['-g', 'postgres'], { encoding: 'utf8' });
    if (uid.status !== 0) throw new Error('pg-cluster: running as root but there is no "postgres" user to run initdb as');
    chownSync(dataDir, Number(uid.stdout.trim()), Number(gid.stdout.trim()));
  }
  chmodSync(dataDir, 0o700);
  const port = await freePort();
  // No fsync: the cluster lives for one test run and is deleted after.
  runPg(binDir, 'initdb', ['-D', dataDir, '-U', 'postgres', '--auth=trust', '--no-sync', '-E', 'UTF8', '--locale=C']);
  const serverOptions = [
    `-p ${port}`,
    `-k ${dataDir}`,
    "-c listen_addresses='127.0.0.1'",
    '-c fsync=off',
    '-c synchronous_commit=off',
    '-c full_page_writes=off',
    '-c max_connections=200',
  ].join(' ');
  runPg(binDir, 'pg_ctl', ['-D', dataDir, '-o', serverOptions, '-l', join(dataDir, 'server.log'), '-w', '-t', '60', 'start']);
  let stopped = false;
  return {
    adminUrl: `postgres://postgres@127.0.0.1:${port}/postgres`,
    port,
    dataDir,
    stop() {
      if (stopped) return;
      stopped = true;
      try {
        runPg(binDir, 'pg_ctl', ['-D', dataDir, '-m', 'immediate', '-w', 'stop']);
      } finally {
        rmSync(dataDir, { recursive: true, force: true });
      }
    },
  };
}
