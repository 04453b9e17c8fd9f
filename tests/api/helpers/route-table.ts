import type { Role } from '../../../server/auth/policy';
import { DEMO_PASSWORD } from '../../../server/db/seed-demo';
import { newOneTimeToken } from '../../../server/services/one-time-token.service';
import { createUnderlay } from '../../../server/services/underlays.service';
import { makeScheme, twoBayPlan } from './schemes-fixture';
import { makeStudy, WEST_BAY_STUDY } from './study-fixture';
import { tinyPng } from './underlay-images';
import type { TestApp } from './test-app';

// Every API route and who may call it. role-matrix.test.ts drives one check per row and
// role, and fails when the app registers a route that is missing here.
// To add a route: add a row with the Express pattern exactly as registered.

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface RouteFixture {
  t: TestApp;
  /** A new project of the demo firm (so destructive rows get their own). */
  ownProjectId(): Promise<string>;
  /** A new project of the other firm. */
  foreignProjectId(): Promise<string>;
  uniqueEmail(): string;
}

export interface RouteCase {
  method: Method;
  /** The pattern as registered on Express, e.g. '/api/projects/:id'. */
  route: string;
  /** 'public': anyone, signed in or not; 'signed-in': any role; else the roles allowed. */
  allowed: 'public' | 'signed-in' | readonly Role[];
  /** Status an allowed caller gets. */
  okStatus: number;
  /** Status an anonymous caller gets on a non-public route (default 401). */
  anonymousStatus?: number;
  /** Concrete path for the caller's own firm (default: route itself). */
  path?: (fx: RouteFixture) => Promise<string> | string;
  body?: (fx: RouteFixture) => unknown;
  /** The same route aimed at another firm's resource: an allowed role must get 404. */
  foreignPath?: (fx: RouteFixture) => Promise<string>;
  /** A multipart body (file upload) instead of JSON. */
  multipart?: (fx: RouteFixture) => { fields: Record<string, string>; file: { field: string; content: Buffer; filename: string } };
}

// Fixtures for the team, invitation and password-reset rows: rows made straight in the
// database, so each call gets its own (a used token or removed person cannot be reused).
let fixtureCounter = 0;
const fixtureEmail = (what: string) => `${what}-${Date.now()}-${++fixtureCounter}@matrix.example`;

/** A pending invitation of the demo firm (or of the other firm); returns id and token. */
async function pendingInvitation(fx: RouteFixture, firm: 'own' | 'foreign' = 'own') {
  const { token, tokenHash } = newOneTimeToken();
  const row = await fx.t.ctx.db.models.Invitation.create({
    firmId: firm === 'own' ? fx.t.seed.firmId! : fx.t.otherFirmId,
    email: fixtureEmail('invitee'),
    role: 'engineer',
    tokenHash,
    status: 'pending',
    invitedBy: null,
    expiresAt: new Date(Date.now() + 3600_000),
  });
  return { id: row.getDataValue('id'), token };
}

/** A person in the demo firm (or the other firm) with the engineer role; returns the user id. */
async function extraMember(fx: RouteFixture, firm: 'own' | 'foreign' = 'own'): Promise<string> {
  const { User, Membership } = fx.t.ctx.db.models;
  const user = await User.create({ email: fixtureEmail('member'), name: 'Matrix Member', passwordHash: 'x' });
  const userId = user.getDataValue('id');
  await Membership.create({
    firmId: firm === 'own' ? fx.t.seed.firmId! : fx.t.otherFirmId,
    userId,
    role: 'engineer',
  });
  return userId;
}

/** A pending password-reset token of a person of no firm (so no demo account changes). */
async function pendingResetToken(fx: RouteFixture): Promise<string> {
  const { User, PasswordReset } = fx.t.ctx.db.models;
  const user = await User.create({ email: fixtureEmail('reset'), name: 'Matrix Reset', passwordHash: 'x' });
  const { token, tokenHash } = newOneTimeToken();
  await PasswordReset.create({
    userId: user.getDataValue('id'),
    tokenHash,
    status: 'pending',
    expiresAt: new Date(Date.now() + 3600_000),
  });
  return token;
}

export const ROUTE_TABLE: RouteCase[] = [
  { method: 'GET', route: '/api/health', allowed: 'public', okStatus: 200 },
  {
    method: 'POST',
    route: '/api/session',
    allowed: 'public',
    okStatus: 200,
    body: () => ({ email: 'manager@example.com', password: DEMO_PASSWORD }),
  },
  { method: 'GET', route: '/api/session', allowed: 'signed-in', okStatus: 200 },
  // Signing out without a session is harmless, so anonymous also gets 204.
  { method: 'DELETE', route: '/api/session', allowed: 'signed-in', okStatus: 204, anonymousStatus: 204 },
  {
    method: 'POST',
    route: '/api/firms',
    allowed: 'public',
    okStatus: 201,
    body: (fx) => ({
      firmName: 'Matrix Test Firm',
      name: 'Matrix Tester',
      email: fx.uniqueEmail(),
      password: 'long-enough-password',
    }),
  },
  {
    method: 'GET',
    route: '/api/projects',
    allowed: ['owner', 'engineer', 'drafter', 'manager'],
    okStatus: 200,
  },
  {
    method: 'POST',
    route: '/api/projects',
    allowed: ['owner', 'engineer'],
    okStatus: 201,
    body: () => ({ name: 'Matrix project' }),
  },
  {
    method: 'GET',
    route: '/api/projects/:id',
    allowed: ['owner', 'engineer', 'drafter', 'manager'],
    okStatus: 200,
    path: async (fx) => `/api/projects/${await fx.ownProjectId()}`,
    foreignPath: async (fx) => `/api/projects/${await fx.foreignProjectId()}`,
  },
  {
    method: 'PATCH',
    route: '/api/projects/:id',
    allowed: ['owner', 'engineer'],
    okStatus: 200,
    path: async (fx) => `/api/projects/${await fx.ownProjectId()}`,
    body: () => ({ client: 'Renamed client' }),
    foreignPath: async (fx) => `/api/projects/${await fx.foreignProjectId()}`,
  },
  {
    method: 'DELETE',
    route: '/api/projects/:id',
    allowed: ['owner', 'engineer'],
    okStatus: 204,
    path: async (fx) => `/api/projects/${await fx.ownProjectId()}`,
    foreignPath: async (fx) => `/api/projects/${await fx.foreignProjectId()}`,
  },
  // Invitations (issue 8): owners invite; the link's token is the credential for the rest.
  { method: 'GET', route: '/api/invitations', allowed: ['owner'], okStatus: 200 },
  {
    method: 'POST',
    route: '/api/invitations',
    allowed: ['owner'],
    okStatus: 201,
    body: (fx) => ({ email: fx.uniqueEmail(), role: 'drafter' }),
  },
  {
    method: 'POST',
    route: '/api/invitations/:id/resend',
    allowed: ['owner'],
    okStatus: 201,
    path: async (fx) => `/api/invitations/${(await pendingInvitation(fx)).id}/resend`,
    foreignPath: async (fx) => `/api/invitations/${(await pendingInvitation(fx, 'foreign')).id}/resend`,
  },
  {
    method: 'DELETE',
    route: '/api/invitations/:id',
    allowed: ['owner'],
    okStatus: 204,
    path: async (fx) => `/api/invitations/${(await pendingInvitation(fx)).id}`,
    foreignPath: async (fx) => `/api/invitations/${(await pendingInvitation(fx, 'foreign')).id}`,
  },
  {
    method: 'GET',
    route: '/api/invitations/:token',
    allowed: 'public',
    okStatus: 200,
    path: async (fx) => `/api/invitations/${(await pendingInvitation(fx)).token}`,
  },
  {
    method: 'POST',
    route: '/api/invitations/:token/accept',
    allowed: 'public',
    okStatus: 201,
    path: async (fx) => `/api/invitations/${(await pendingInvitation(fx)).token}/accept`,
    body: () => ({ name: 'Matrix Invitee', password: 'long-enough-password' }),
  },
  // Password resets: public, no account enumeration.
  {
    method: 'POST',
    route: '/api/password-resets',
    allowed: 'public',
    okStatus: 202,
    body: () => ({ email: 'nobody-here@matrix.example' }),
  },
  {
    method: 'GET',
    route: '/api/password-resets/:token',
    allowed: 'public',
    okStatus: 200,
    path: async (fx) => `/api/password-resets/${await pendingResetToken(fx)}`,
  },
  {
    method: 'POST',
    route: '/api/password-resets/:token',
    allowed: 'public',
    okStatus: 200,
    path: async (fx) => `/api/password-resets/${await pendingResetToken(fx)}`,
    body: () => ({ password: 'a-new-long-password' }),
  },
  // Team, outbox, audit log: the owner's.
  { method: 'GET', route: '/api/team', allowed: ['owner'], okStatus: 200 },
  {
    method: 'PATCH',
    route: '/api/team/:userId',
    allowed: ['owner'],
    okStatus: 200,
    path: async (fx) => `/api/team/${await extraMember(fx)}`,
    body: () => ({ role: 'drafter' }),
    foreignPath: async (fx) => `/api/team/${await extraMember(fx, 'foreign')}`,
  },
  {
    method: 'DELETE',
    route: '/api/team/:userId',
    allowed: ['owner'],
    okStatus: 204,
    path: async (fx) => `/api/team/${await extraMember(fx)}`,
    foreignPath: async (fx) => `/api/team/${await extraMember(fx, 'foreign')}`,
  },
  { method: 'GET', route: '/api/outbox', allowed: ['owner'], okStatus: 200 },
  { method: 'GET', route: '/api/audit', allowed: ['owner'], okStatus: 200 },
  // Each person's own notification settings.
  { method: 'GET', route: '/api/me/notifications', allowed: 'signed-in', okStatus: 200 },
  {
    method: 'PUT',
    route: '/api/me/notifications',
    allowed: 'signed-in',
    okStatus: 200,
    body: () => ({ schemeSubmitted: true, schemeChosen: false }),
  },
  // Schemes and plans: everyone in the firm reads; engineers and owners write.
  {
    method: 'GET',
    route: '/api/projects/:id/schemes',
    allowed: ['owner', 'engineer', 'drafter', 'manager'],
    okStatus: 200,
    path: async (fx) => `/api/projects/${(await makeScheme(fx.t)).projectId}/schemes`,
    foreignPath: async (fx) => `/api/projects/${(await makeScheme(fx.t, { firm: 'foreign' })).projectId}/schemes`,
  },
  {
    method: 'POST',
    route: '/api/projects/:id/schemes',
    allowed: ['owner', 'engineer'],
    okStatus: 201,
    path: async (fx) => `/api/projects/${await fx.ownProjectId()}/schemes`,
    body: () => ({ name: 'Matrix scheme' }),
    foreignPath: async (fx) => `/api/projects/${await fx.foreignProjectId()}/schemes`,
  },
  ...schemeRows(),
  ...underlayRows(),
  ...draftingRows(),
  ...reviewRows(),
  ...deckProfileRows(),
  ...studyRows(),
];

/** Issue 7: scheme status, comments, activity, Tonnage comparison and exports, unit prices. */
function reviewRows(): RouteCase[] {
  const readers = ['owner', 'engineer', 'drafter', 'manager'] as const;
  const reviewers = ['owner', 'engineer', 'manager'] as const;
  const scheme = (firm: 'own' | 'foreign', suffix: string) => async (fx: RouteFixture) =>
    `/api/schemes/${(await makeScheme(fx.t, { firm })).schemeId}${suffix}`;
  const project = (firm: 'own' | 'foreign', suffix: string) => async (fx: RouteFixture) =>
    `/api/projects/${(await makeScheme(fx.t, { firm, designed: true })).projectId}${suffix}`;
  return [
    {
      method: 'POST', route: '/api/schemes/:id/status', allowed: reviewers, okStatus: 200,
      path: scheme('own', '/status'), body: () => ({ status: 'in_review' }), foreignPath: scheme('foreign', '/status'),
    },
    { method: 'GET', route: '/api/schemes/:id/comments', allowed: readers, okStatus: 200, path: scheme('own', '/comments'), foreignPath: scheme('foreign', '/comments') },
    {
      method: 'POST', route: '/api/schemes/:id/comments', allowed: reviewers, okStatus: 201,
      path: scheme('own', '/comments'), body: () => ({ body: 'Matrix comment' }), foreignPath: scheme('foreign', '/comments'),
    },
    { method: 'GET', route: '/api/schemes/:id/activity', allowed: readers, okStatus: 200, path: scheme('own', '/activity'), foreignPath: scheme('foreign', '/activity') },
    { method: 'GET', route: '/api/projects/:id/comparison', allowed: readers, okStatus: 200, path: project('own', '/comparison'), foreignPath: project('foreign', '/comparison') },
    { method: 'GET', route: '/api/projects/:id/comparison.csv', allowed: readers, okStatus: 200, path: project('own', '/comparison.csv'), foreignPath: project('foreign', '/comparison.csv') },
    { method: 'GET', route: '/api/projects/:id/comparison.pdf', allowed: readers, okStatus: 200, path: project('own', '/comparison.pdf'), foreignPath: project('foreign', '/comparison.pdf') },
    { method: 'GET', route: '/api/unit-prices', allowed: readers, okStatus: 200 },
    {
      method: 'PUT', route: '/api/unit-prices', allowed: ['owner', 'manager'], okStatus: 200,
      body: () => ({ steel_usd_per_ton: 5000, connection_usd_each: 200 }),
    },
    { method: 'GET', route: '/api/unit-prices/history', allowed: readers, okStatus: 200 },
  ];
}

/** Deck profile library (issue 11): every role reads; engineers and owners keep the firm's own. */
const MATRIX_SLAB = { ribHeight_in: 3, toppingThickness_in: 3.25, ribAvgWidth_in: 6, ribSpacing_in: 12, concreteWeight_pcf: 114, fc_ksi: 3.5, deckWeight_psf: 2.5 };
function deckProfileRows(): RouteCase[] {
  const readers = ['owner', 'engineer', 'drafter', 'manager'] as const;
  const writers = ['owner', 'engineer'] as const;
  const profile = (firm: 'own' | 'foreign') => async (fx: RouteFixture) => {
    const now = new Date();
    const row = await fx.t.ctx.db.models.DeckProfile.create({
      firmId: firm === 'own' ? fx.t.seed.firmId! : fx.t.otherFirmId, name: `Matrix deck ${Date.now()}-${++fixtureCounter}`, slab: MATRIX_SLAB, userId: null, createdAt: now, updatedAt: now,
    });
    return `/api/deck-profiles/${row.getDataValue('id')}`;
  };
  return [
    { method: 'GET', route: '/api/deck-profiles', allowed: readers, okStatus: 200 },
    { method: 'POST', route: '/api/deck-profiles', allowed: writers, okStatus: 201, body: () => ({ name: `Matrix profile ${Date.now()}-${++fixtureCounter}`, slab: MATRIX_SLAB }) },
    {
      method: 'PUT', route: '/api/deck-profiles/:id', allowed: writers, okStatus: 200,
      path: profile('own'), body: () => ({ name: `Matrix renamed ${Date.now()}-${++fixtureCounter}`, slab: MATRIX_SLAB }), foreignPath: profile('foreign'),
    },
    {
      method: 'PATCH', route: '/api/deck-profiles/:id', allowed: writers, okStatus: 200,
      path: profile('own'), body: () => ({ name: `Matrix rename only ${Date.now()}-${++fixtureCounter}` }), foreignPath: profile('foreign'),
    },
    { method: 'DELETE', route: '/api/deck-profiles/:id', allowed: writers, okStatus: 204, path: profile('own'), foreignPath: profile('foreign') },
  ];
}

/** Underlays: every role of the firm sees them; engineers and owners upload, place and delete. */
function underlayRows(): RouteCase[] {
  const readers = ['owner', 'engineer', 'drafter', 'manager'] as const;
  const writers = ['owner', 'engineer'] as const;
  const scheme = (firm: 'own' | 'foreign', suffix: string) => async (fx: RouteFixture) =>
    `/api/schemes/${(await makeScheme(fx.t, { firm })).schemeId}${suffix}`;
  const underlay = (firm: 'own' | 'foreign', suffix = '') => async (fx: RouteFixture) => {
    const { schemeId } = await makeScheme(fx.t, { firm });
    const user = firm === 'own' ? fx.t.seed.userIds.engineer! : (await fx.t.ctx.db.models.User.findOne({ where: { email: 'rosalind@quillon.example' } }))!.getDataValue('id');
    const actor = { firmId: firm === 'own' ? fx.t.seed.firmId! : fx.t.otherFirmId, userId: user };
    const u = await createUnderlay(fx.t.ctx.db, { uploadDir: fx.t.config.uploadDir }, actor, schemeId, {
      levelId: 'L2',
      file: { buffer: tinyPng(2, 2), originalName: 'matrix.png' },
    });
    return `/api/underlays/${u.id}${suffix}`;
  };
  return [
    {
      method: 'POST', route: '/api/schemes/:id/underlays', allowed: writers, okStatus: 201,
      path: scheme('own', '/underlays'), foreignPath: scheme('foreign', '/underlays'),
      multipart: () => ({ fields: { level: 'L2' }, file: { field: 'file', content: tinyPng(2, 2), filename: 'matrix.png' } }),
    },
    { method: 'GET', route: '/api/schemes/:id/underlays', allowed: readers, okStatus: 200, path: scheme('own', '/underlays'), foreignPath: scheme('foreign', '/underlays') },
    { method: 'GET', route: '/api/underlays/:id/image', allowed: readers, okStatus: 200, path: underlay('own', '/image'), foreignPath: underlay('foreign', '/image') },
    {
      method: 'PATCH', route: '/api/underlays/:id', allowed: writers, okStatus: 200,
      path: underlay('own'), body: () => ({ opacity: 0.7 }), foreignPath: underlay('foreign'),
    },
    { method: 'DELETE', route: '/api/underlays/:id', allowed: writers, okStatus: 204, path: underlay('own'), foreignPath: underlay('foreign') },
  ];
}

function schemeRows(): RouteCase[] {
  const own = (suffix = '', designed = false) => async (fx: RouteFixture) =>
    `/api/schemes/${(await makeScheme(fx.t, { designed })).schemeId}${suffix}`;
  const foreign = (suffix = '') => async (fx: RouteFixture) =>
    `/api/schemes/${(await makeScheme(fx.t, { firm: 'foreign', designed: true })).schemeId}${suffix}`;
  const readers = ['owner', 'engineer', 'drafter', 'manager'] as const;
  const writers = ['owner', 'engineer'] as const;
  return [
    { method: 'GET', route: '/api/schemes/:id', allowed: readers, okStatus: 200, path: own(), foreignPath: foreign() },
    {
      method: 'PATCH', route: '/api/schemes/:id', allowed: writers, okStatus: 200,
      path: own(), body: () => ({ name: 'Renamed in the matrix' }), foreignPath: foreign(),
    },
    { method: 'DELETE', route: '/api/schemes/:id', allowed: writers, okStatus: 204, path: own(), foreignPath: foreign() },
    { method: 'GET', route: '/api/schemes/:id/export', allowed: readers, okStatus: 200, path: own('/export'), foreignPath: foreign('/export') },
    {
      method: 'PUT', route: '/api/schemes/:id/plan', allowed: writers, okStatus: 200,
      path: own('/plan'), body: () => ({ revision: 1, plan: twoBayPlan() }), foreignPath: foreign('/plan'),
    },
    { method: 'POST', route: '/api/schemes/:id/design', allowed: writers, okStatus: 200, path: own('/design'), foreignPath: foreign('/design') },
    { method: 'GET', route: '/api/schemes/:id/design', allowed: readers, okStatus: 200, path: own('/design', true), foreignPath: foreign('/design') },
    {
      method: 'POST', route: '/api/schemes/:id/clone', allowed: writers, okStatus: 201,
      path: own('/clone'), body: () => ({}), foreignPath: foreign('/clone'),
    },
    { method: 'GET', route: '/api/schemes/:id/revisions', allowed: readers, okStatus: 200, path: own('/revisions'), foreignPath: foreign('/revisions') },
    {
      method: 'POST', route: '/api/schemes/:id/revisions/:revision/restore', allowed: writers, okStatus: 200,
      path: own('/revisions/1/restore'), foreignPath: foreign('/revisions/1/restore'),
    },
  ];
}

/** Issue 6: piece marks (drafters may edit), schedule JSON/CSV, plan sheets (model and PDF). */
function draftingRows(): RouteCase[] {
  const readers = ['owner', 'engineer', 'drafter', 'manager'] as const;
  const markers = ['owner', 'engineer', 'drafter'] as const;
  const scheme = (firm: 'own' | 'foreign', suffix: string) => async (fx: RouteFixture) =>
    `/api/schemes/${(await makeScheme(fx.t, { firm, designed: true })).schemeId}${suffix}`;
  return [
    {
      method: 'PATCH', route: '/api/schemes/:id/marks', allowed: markers, okStatus: 200,
      path: scheme('own', '/marks'), body: () => ({ revision: 1, marks: [{ memberId: 'b2', mark: '2B9' }] }),
      foreignPath: scheme('foreign', '/marks'),
    },
    {
      method: 'POST', route: '/api/schemes/:id/marks/renumber', allowed: markers, okStatus: 200,
      path: scheme('own', '/marks/renumber'), body: () => ({ keepManual: false }), foreignPath: scheme('foreign', '/marks/renumber'),
    },
    { method: 'GET', route: '/api/schemes/:id/schedule', allowed: readers, okStatus: 200, path: scheme('own', '/schedule'), foreignPath: scheme('foreign', '/schedule') },
    { method: 'GET', route: '/api/schemes/:id/schedule.csv', allowed: readers, okStatus: 200, path: scheme('own', '/schedule.csv'), foreignPath: scheme('foreign', '/schedule.csv') },
    { method: 'GET', route: '/api/schemes/:id/plan-sheet', allowed: readers, okStatus: 200, path: scheme('own', '/plan-sheet'), foreignPath: scheme('foreign', '/plan-sheet') },
    {
      method: 'GET', route: '/api/schemes/:id/plan-sheet.pdf', allowed: readers, okStatus: 200,
      path: scheme('own', '/plan-sheet.pdf?level=L2'), foreignPath: scheme('foreign', '/plan-sheet.pdf'),
    },
    {
      method: 'GET', route: '/api/schemes/:id/calc-book.pdf', allowed: readers, okStatus: 200,
      path: scheme('own', '/calc-book.pdf?level=L2'), foreignPath: scheme('foreign', '/calc-book.pdf'),
    },
    {
      method: 'GET', route: '/api/schemes/:id/members/:memberId/calc-sheet.pdf', allowed: readers, okStatus: 200,
      path: scheme('own', '/members/b2/calc-sheet.pdf'), foreignPath: scheme('foreign', '/members/b2/calc-sheet.pdf'),
    },
    { method: 'GET', route: '/api/schemes/:id/model.ifc', allowed: readers, okStatus: 200, path: scheme('own', '/model.ifc'), foreignPath: scheme('foreign', '/model.ifc') },
  ];
}

/** Issue 15: bay studies (engineers and owners run them and make schemes; everyone reads). */
function studyRows(): RouteCase[] {
  const readers = ['owner', 'engineer', 'drafter', 'manager'] as const;
  const writers = ['owner', 'engineer'] as const;
  const scheme = (firm: 'own' | 'foreign', suffix: string) => async (fx: RouteFixture) =>
    `/api/schemes/${(await makeScheme(fx.t, { firm })).schemeId}${suffix}`;
  const study = (firm: 'own' | 'foreign', suffix = '') => async (fx: RouteFixture) => {
    const s = await makeStudy(fx.t, { firm });
    return `/api/schemes/${s.schemeId}/studies/${s.studyId}${suffix}`;
  };
  return [
    {
      method: 'POST', route: '/api/schemes/:id/studies', allowed: writers, okStatus: 201,
      path: scheme('own', '/studies'), body: () => WEST_BAY_STUDY, foreignPath: scheme('foreign', '/studies'),
    },
    { method: 'GET', route: '/api/schemes/:id/studies', allowed: readers, okStatus: 200, path: scheme('own', '/studies'), foreignPath: scheme('foreign', '/studies') },
    { method: 'GET', route: '/api/schemes/:id/studies/:studyId', allowed: readers, okStatus: 200, path: study('own'), foreignPath: study('foreign') },
    {
      method: 'POST', route: '/api/schemes/:id/studies/:studyId/schemes', allowed: writers, okStatus: 201,
      path: study('own', '/schemes'), body: () => ({ optionId: 'y-s10-dany-f50' }), foreignPath: study('foreign', '/schemes'),
    },
  ];
}
