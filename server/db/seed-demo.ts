import { hashPassword } from '../auth/password';
import type { Role } from '../auth/policy';
import type { Db } from '../models/models';
import { demoBuildingStep } from './seed-demo-building';

// Demo data: an invented firm and project of Baywright's own. Every step is idempotent
// (find-or-create by a natural key), so the seed can run again on a seeded database.
// Later features append steps (schemes, levels, plans) that read ids from SeedState.

export const DEMO_PASSWORD = 'baywright-demo';
export const DEMO_FIRM_NAME = 'Larkspur Structural Partners';
export const DEMO_PROJECT_NAME = 'Harrow Quay Clinic';

export const DEMO_USERS: ReadonlyArray<{ role: Role; email: string; name: string }> = [
  { role: 'owner', email: 'owner@example.com', name: 'Imogen Ashdown' },
  { role: 'engineer', email: 'engineer@example.com', name: 'Tobias Renfrew' },
  { role: 'drafter', email: 'drafter@example.com', name: 'Priya Calloway' },
  { role: 'manager', email: 'manager@example.com', name: 'Dominic Hale' },
];

export interface SeedState {
  firmId?: string;
  userIds: Partial<Record<Role, string>>;
  projectId?: string;
  [key: string]: unknown;
}

export interface SeedStep {
  name: string;
  run(db: Db, state: SeedState): Promise<void>;
}

function required<T>(value: T | undefined, what: string): T {
  if (value === undefined) throw new Error(`seed: ${what} missing (earlier step did not run)`);
  return value;
}

export const DEMO_SEED_STEPS: SeedStep[] = [
  {
    name: 'firm',
    async run({ models }, state) {
      const [firm] = await models.Firm.findOrCreate({
        where: { name: DEMO_FIRM_NAME },
        defaults: { name: DEMO_FIRM_NAME },
      });
      state.firmId = firm.getDataValue('id');
    },
  },
  {
    name: 'users',
    async run({ models }, state) {
      const firmId = required(state.firmId, 'firm');
      for (const demo of DEMO_USERS) {
        let user = await models.User.findOne({ where: { email: demo.email } });
        if (!user) {
          user = await models.User.create({
            email: demo.email,
            name: demo.name,
            passwordHash: await hashPassword(DEMO_PASSWORD),
          });
        }
        const userId = user.getDataValue('id');
        await models.Membership.findOrCreate({
          where: { firmId, userId },
          defaults: { firmId, userId, role: demo.role },
        });
        state.userIds[demo.role] = userId;
      }
    },
  },
  {
    name: 'project',
    async run({ models }, state) {
      const firmId = required(state.firmId, 'firm');
      const [project] = await models.Project.findOrCreate({
        where: { firmId, name: DEMO_PROJECT_NAME },
        defaults: {
          firmId,
          name: DEMO_PROJECT_NAME,
          number: 'LSP-2417',
          client: 'Wrenfield Community Health Trust',
          address: '14 Tidemill Row, Harrow Quay',
          description:
            'Four-storey outpatient clinic with a steel frame: composite slab on metal deck, ' +
            'wide-flange girders and infill beams, roof plant over the central bay.',
          createdBy: state.userIds.engineer ?? null,
        },
      });
      state.projectId = project.getDataValue('id');
    },
  },
  // The clinic building: two framing schemes, each designed (seed-demo-building.ts).
  demoBuildingStep,
  {
    // Firm unit prices (an invented example, marked so in the app) and Scheme B in review.
    name: 'review-and-prices',
    async run({ models }, state) {
      const firmId = required(state.firmId, 'firm');
      if ((await models.UnitPrice.count({ where: { firmId } })) === 0) {
        await models.UnitPrice.create({
          firmId,
          ...DEMO_UNIT_PRICES,
          example: true,
          note: 'Invented example prices for the demo, not a quotation.',
          userId: state.userIds.owner ?? null,
          createdAt: new Date(),
        });
      }
      const schemeIds = (state.demoSchemeIds as string[] | undefined) ?? [];
      const inReview = schemeIds[1];
      // Only on a fresh seed: a status anyone has set since is left alone.
      if (inReview && (await models.SchemeActivity.count({ where: { schemeId: schemeIds } })) === 0) {
        await models.Scheme.update({ status: 'in_review' }, { where: { id: inReview, status: 'draft' } });
        await models.SchemeActivity.create({
          schemeId: inReview,
          userId: state.userIds.engineer ?? null,
          kind: 'status_changed',
          detail: JSON.stringify({ from: 'draft', to: 'in_review' }),
          createdAt: new Date(),
        });
        await models.SchemeComment.create({
          schemeId: inReview,
          userId: state.userIds.engineer ?? null,
          body: 'Submitted for review: same grid as Scheme A with the infill beams closer together. Please compare the tonnage and cost before we pick one.',
          createdAt: new Date(),
        });
      }
    },
  },
];

/** Invented, plausible example prices for the demo firm (not market data). */
export const DEMO_UNIT_PRICES = { steelUsdPerTon: 4800, connectionUsdEach: 210 } as const;

/** Runs every demo seed step in order; safe to run again. */
export async function seedDemo(db: Db, steps: SeedStep[] = DEMO_SEED_STEPS): Promise<SeedState> {
  const state: SeedState = { userIds: {} };
  for (const step of steps) await step.run(db, state);
  return state;
}

/** True when no firm exists yet (start-up seeds only then). */
export async function isDatabaseEmpty(db: Db): Promise<boolean> {
  return (await db.models.Firm.count()) === 0;
}
