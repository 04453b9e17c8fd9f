import { afterAll, beforeAll, expect } from 'vitest';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import type { Express } from 'express';
import request from 'supertest';
import { createApp, getAppContext } from '../../../server/app';
import type { AppContext } from '../../../server/app-context';
import { SESSION_COOKIE_NAME } from '../../../server/auth/lucia';
import type { Role } from '../../../server/auth/policy';
import { loadConfig, type Config } from '../../../server/config';
import { connectDatabase } from '../../../server/db/connection';
import { migrateToLatest } from '../../../server/db/migrator';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo, type SeedState } from '../../../server/db/seed-demo';
import { freshTestDatabase } from './test-database';

export type Agent = ReturnType<typeof request.agent>;

export const OTHER_FIRM = {
  firmName: 'Quillon Frame Studio',
  name: 'Rosalind Okafor',
  email: 'rosalind@quillon.example',
  password: 'quillon-frame-owner',
} as const;

export interface TestApp {
  app: Express;
  ctx: AppContext;
  config: Config;
  seed: SeedState;
  /** http://127.0.0.1:<port>: the Origin every agent sends. */
  origin: string;
  /** Demo firm agents, signed in through POST /api/session. */
  agents: Record<Role, Agent>;
  /** Owner of a second firm (signed up through POST /api/firms). */
  otherOwner: Agent;
  otherFirmId: string;
  /** An agent with the Origin header and no session. */
  anonymous(): Agent;
  /** A new agent for role with a session minted directly (no sign-in, no rate limit). */
  freshAgent(role: Role | 'other-owner'): Promise<Agent>;
  /** Signs in through the API; returns the agent (status checked by the caller). */
  signIn(email: string, password: string): Promise<{ agent: Agent; res: request.Response }>;
  /** 5xx errors the app logged (tests assert it stays empty). */
  serverErrors: unknown[];
  close(): Promise<void>;
}

export function testConfig(overrides: Partial<Config> = {}): Config {
  return {
    ...loadConfig({ NODE_ENV: 'test', DATABASE_URL: 'sqlite::memory:' }),
    // Uploaded files (underlays) go to the OS temp folder, never into the repository's data/.
    uploadDir: join(tmpdir(), 'baywright-test-uploads'),
    ...overrides,
  };
}

/**
 * A fresh database (in-memory SQLite, or a new PostgreSQL database when TEST_PG_URL is set)
 * with migrations and the demo seed, the app listening on an ephemeral port, and signed-in
 * agents for every role.
 */
export async function createTestApp(overrides: Partial<Config> = {}): Promise<TestApp> {
  const database = overrides.databaseUrl ? null : await freshTestDatabase();
  const config = testConfig(database ? { ...overrides, databaseUrl: database.url } : overrides);
  const db = await connectDatabase(config.databaseUrl);
  await migrateToLatest(db.sequelize);
  const seed = await seedDemo(db);
  const serverErrors: unknown[] = [];
  const app = createApp({
    sequelize: db.sequelize,
    models: db.models,
    config,
    logError: (err) => serverErrors.push(err),
  });
  const ctx = getAppContext(app);
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  const origin = `http://127.0.0.1:${port}`;

  const anonymous = (): Agent => request.agent(server).set('Origin', origin);

  const signIn = async (email: string, password: string) => {
    const agent = anonymous();
    const res = await agent.post('/api/session').send({ email, password });
    return { agent, res };
  };

  const agents = {} as Record<Role, Agent>;
  for (const user of DEMO_USERS) {
    const { agent, res } = await signIn(user.email, DEMO_PASSWORD);
    if (res.status !== 200) throw new Error(`test-app: sign-in as ${user.role} gave ${res.status}`);
    agents[user.role] = agent;
  }

  const otherOwner = anonymous();
  const signUp = await otherOwner.post('/api/firms').send(OTHER_FIRM);
  if (signUp.status !== 201) throw new Error(`test-app: sign-up gave ${signUp.status}`);
  const otherFirmId: string = signUp.body.firm.id;
  const otherOwnerId: string = signUp.body.user.id;

  const freshAgent = async (role: Role | 'other-owner'): Promise<Agent> => {
    const who =
      role === 'other-owner'
        ? { userId: otherOwnerId, firmId: otherFirmId }
        : { userId: seed.userIds[role] as string, firmId: seed.firmId as string };
    const session = await ctx.lucia.createSession(who.userId, { firmId: who.firmId });
    const agent = anonymous();
    agent.jar.setCookie(`${SESSION_COOKIE_NAME}=${session.id}; Path=/`, '127.0.0.1', '/');
    return agent;
  };

  return {
    app,
    ctx,
    config,
    seed,
    origin,
    agents,
    otherOwner,
    otherFirmId,
    anonymous,
    freshAgent,
    signIn,
    serverErrors,
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await db.sequelize.close();
      await database?.drop();
    },
  };
}

/** Parses Set-Cookie headers of a response into name → raw header. */
export function setCookies(res: request.Response): Record<string, string> {
  const raw = res.headers['set-cookie'] as unknown as string[] | string | undefined;
  const list = raw === undefined ? [] : Array.isArray(raw) ? raw : [raw];
  const out: Record<string, string> = {};
  for (const header of list) out[header.split('=')[0]] = header;
  return out;
}

/**
 * A test app for the whole file: made before the first test, closed after the last, and the
 * file fails if the server logged an error meanwhile. Read `.app` inside tests.
 */
export function useTestApp(overrides: Partial<Config> = {}): { readonly app: TestApp } {
  const holder: { app: TestApp | null } = { app: null };
  beforeAll(async () => {
    holder.app = await createTestApp(overrides);
  });
  afterAll(async () => {
    const app = holder.app;
    if (!app) return;
    expect(app.serverErrors).toEqual([]);
    await app.close();
  });
  return {
    get app(): TestApp {
      if (!holder.app) throw new Error('useTestApp: the app is made in beforeAll; read it inside a test');
      return holder.app;
    },
  };
}
