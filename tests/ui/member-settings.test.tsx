import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { designScheme, type SchemeMember } from '../../shared/engine/index';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';
import { MemberSheet, type MemberSheetProps } from '../../src/features/member-sheet/components/member-sheet.component';
import { fromSettingsForm, toSettingsForm } from '../../src/features/member-sheet/lib/member-settings.model';

// Issue 16 item 14: the Member sheet sets bracing / Lb and per-member deflection limits, and
// shows the Lb and limits the design used with where each comes from.

let plan: Plan;
const raw = () => JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'));

beforeAll(() => {
  plan = parsePlanFile(raw()).plan!;
});

/** The two-bay fixture designed with b2's own settings (as the Plan re-designs after an edit). */
function designedWith(settings: Partial<Plan['members'][number]>): { plan: Plan; b2: SchemeMember } {
  const p: Plan = { ...plan, members: plan.members.map((m) => (m.id === 'b2' ? { ...m, ...settings } : m)) };
  return { plan: p, b2: designScheme(p).members.find((m) => m.id === 'b2')! };
}

function renderSheet(p: Plan, member: SchemeMember, overrides: Partial<MemberSheetProps> = {}) {
  const props: MemberSheetProps = {
    member,
    designBasis: p.designBasis,
    planMember: p.members.find((m) => m.id === member.id),
    units: 'US',
    canEdit: true,
    onLockShape: vi.fn(),
    onConstraints: vi.fn(),
    onMemberSettings: vi.fn(),
    calcSheetHref: '/api/schemes/s1/members/b2/calc-sheet.pdf',
    onClose: vi.fn(),
    ...overrides,
  };
  render(<MemberSheet {...props} />);
  return props;
}

describe('Member sheet: bracing and deflection limits', () => {
  it('when b2 follows the design basis, then the sheet shows Lb 0 (deck bracing), span/360 and span/240, each "from the design basis"', () => {
    const { plan: p, b2 } = designedWith({});
    renderSheet(p, b2);
    // Fixture deck spans across the beams: continuously braced (design-basis §3), Lb = 0.
    expect(screen.getByTestId('member-lb-used')).toHaveTextContent(/^0\.00 ft/);
    expect(screen.getByTestId('member-lb-source')).toHaveTextContent('from the design basis');
    // IBC Table 1604.3 floor defaults, the fixture's design basis.
    expect(screen.getByTestId('member-live-limit-used')).toHaveTextContent('span/360 (from the design basis)');
    expect(screen.getByTestId('member-total-limit-used')).toHaveTextContent('span/240 (from the design basis)');
  });

  it('when third points and live span/600 are applied, then onMemberSettings receives the points at L/3 and 2L/3 and the limit', async () => {
    const { plan: p, b2 } = designedWith({});
    const props = renderSheet(p, b2);
    const form = screen.getByRole('form', { name: 'Bracing and deflection limits' });
    await userEvent.selectOptions(within(form).getByLabelText('Compression flange braced'), 'thirds');
    await userEvent.type(within(form).getByLabelText(/Live limit span\/n/), '600');
    await userEvent.click(within(form).getByRole('button', { name: 'Apply bracing and limits' }));
    // b2 spans 36 ft (fixture): third points at 12 and 24 ft.
    expect(props.onMemberSettings).toHaveBeenCalledWith({ bracing: { points_ft: [12, 24] }, Lb_override_ft: null, deflectionLimits: { live: 600, total: null } });
  });

  it('when the design is re-run with those settings, then the sheet shows Lb 12 ft and span/600 "set on this member", and the ratio or size changes', () => {
    const { b2: before } = designedWith({});
    const { plan: p, b2 } = designedWith({ bracing: { points_ft: [12, 24] }, deflectionLimits: { live: 600, total: null } });
    renderSheet(p, b2);
    expect(screen.getByTestId('member-lb-used')).toHaveTextContent(/^12\.00 ft/); // 36 ft / 3
    expect(screen.getByTestId('member-lb-source')).toHaveTextContent('set on this member');
    expect(screen.getByTestId('member-live-limit-used')).toHaveTextContent('span/600 (set on this member)');
    expect(screen.getByTestId('member-total-limit-used')).toHaveTextContent('span/240 (from the design basis)');
    expect(b2.design!.checks.find((c) => c.name === 'deflectionLive')!.limit_n).toBe(600);
    expect(b2.shape !== before.shape || b2.ratio! > before.ratio!).toBe(true);
    // The form reads back what is set.
    const form = screen.getByRole('form', { name: 'Bracing and deflection limits' });
    expect(within(form).getByLabelText('Compression flange braced')).toHaveValue('thirds');
    expect(within(form).getByLabelText(/Live limit span\/n/)).toHaveValue('600');
  });

  it('when a brace point lies outside the span or a limit is not a number, then each field says why and nothing is sent', async () => {
    const { plan: p, b2 } = designedWith({});
    const props = renderSheet(p, b2);
    const form = screen.getByRole('form', { name: 'Bracing and deflection limits' });
    await userEvent.selectOptions(within(form).getByLabelText('Compression flange braced'), 'points');
    await userEvent.type(within(form).getByLabelText(/Brace points from the start support/), '10, 40');
    await userEvent.type(within(form).getByLabelText(/Total limit span\/n/), 'stiff');
    await userEvent.click(within(form).getByRole('button', { name: 'Apply bracing and limits' }));
    expect(within(form).getByText(/Brace points: 40 is not inside the span \(0 to 36\.00 ft\)/)).toBeInTheDocument();
    expect(within(form).getByText(/Total-load deflection limit: enter the n of span\/n/)).toBeInTheDocument();
    expect(props.onMemberSettings).not.toHaveBeenCalled();
  });

  it('when a member limit is looser than the design basis, then the sheet says so', () => {
    const { plan: p, b2 } = designedWith({ deflectionLimits: { live: 240 } });
    renderSheet(p, b2);
    expect(screen.getByRole('note')).toHaveTextContent('The live-load limit set on this member (span/240) is looser than the design basis (span/360).');
  });

  it('when "Follow the design basis" is pressed, then every member setting is cleared', async () => {
    const { plan: p, b2 } = designedWith({ bracing: 'none', Lb_override_ft: 9, deflectionLimits: { live: 600 } });
    const props = renderSheet(p, b2);
    expect(screen.getByTestId('member-lb-used')).toHaveTextContent(/^9\.00 ft/);
    await userEvent.click(screen.getByRole('button', { name: 'Follow the design basis' }));
    expect(props.onMemberSettings).toHaveBeenCalledWith({ bracing: null, Lb_override_ft: null, deflectionLimits: null });
  });

  it('when the role cannot edit (drafter, manager), then the Lb and limits used are shown without controls', () => {
    const { plan: p, b2 } = designedWith({ deflectionLimits: { live: 600 } });
    renderSheet(p, b2, { canEdit: false });
    expect(screen.getByTestId('member-live-limit-used')).toHaveTextContent('span/600 (set on this member)');
    expect(screen.queryByRole('form', { name: 'Bracing and deflection limits' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Follow the design basis' })).not.toBeInTheDocument();
  });

  it('when shown, then the calc sheet link points at the member calc sheet PDF', () => {
    const { plan: p, b2 } = designedWith({});
    renderSheet(p, b2);
    expect(screen.getByTestId('member-calc-sheet-link')).toHaveAttribute('href', '/api/schemes/s1/members/b2/calc-sheet.pdf');
  });
});

describe('member settings form model', () => {
  it('when SI brace points are typed in metres, then they are stored in feet (NIST SP 811: 1 ft = 0.3048 m)', () => {
    const r = fromSettingsForm({ mode: 'points', points: '3.048, 6.096', lbOverride: '', liveLimit: '', totalLimit: '' }, 36, 'SI');
    expect(r.ok && r.value.bracing).toEqual({ points_ft: [expect.closeTo(10, 9), expect.closeTo(20, 9)] });
  });

  it('when an Lb override above the span is typed, then it is refused naming the field', () => {
    const r = fromSettingsForm({ mode: 'auto', points: '', lbOverride: '40', liveLimit: '', totalLimit: '' }, 36, 'US');
    expect(r.ok).toBe(false);
    expect(!r.ok && r.errors.lbOverride).toMatch(/^Lb override: must be above 0 and at most the span/);
  });

  it('when third points are stored, then the form reads them back as third points', () => {
    expect(toSettingsForm({ bracing: { points_ft: [12, 24] }, Lb_override_ft: null, deflectionLimits: null }, 36, 'US').mode).toBe('thirds');
    expect(toSettingsForm({ bracing: { points_ft: [10, 24] }, Lb_override_ft: null, deflectionLimits: null }, 36, 'US')).toMatchObject({ mode: 'points', points: '10.00, 24.00' });
  });
});
