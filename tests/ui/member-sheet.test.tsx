import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { beforeAll, describe, expect, it, vi } from 'vitest';
import { designMember, designScheme, memberAlternatives, type SchemeMember, type SchemeResult } from '../../shared/engine/index';
import { parsePlanFile, type Plan } from '../../shared/schemas/plan.schema';
import { MemberSheet, type MemberSheetProps } from '../../src/features/member-sheet/components/member-sheet.component';
import { sheetDesignInput } from '../../src/features/member-sheet/lib/member-sheet.model';
import { formatRatio } from '../../src/lib/utilisation';
import { formatQuantity } from '../../src/lib/units';

let plan: Plan;
let scheme: SchemeResult;
let girder: SchemeMember;

beforeAll(() => {
  const raw = JSON.parse(readFileSync(resolve(__dirname, '../fixtures/plans/two-bay.plan.json'), 'utf8'));
  plan = parsePlanFile(raw).plan!;
  scheme = designScheme(plan);
  girder = scheme.members.find((m) => m.id === 'gA12')!;
});

function renderSheet(overrides: Partial<MemberSheetProps> = {}) {
  const props: MemberSheetProps = {
    member: girder,
    designBasis: plan.designBasis,
    planMember: plan.members.find((m) => m.id === (overrides.member ?? girder).id),
    units: 'US',
    canEdit: true,
    onLockShape: vi.fn(),
    onConstraints: vi.fn(),
    onClose: vi.fn(),
    ...overrides,
  };
  render(<MemberSheet {...props} />);
  return props;
}

describe('MemberSheet, from a real scheme design (two-bay fixture, girder gA12)', () => {
  it('when rebuilt from the scheme member, then the sheet input designs to the same shape and ratio as the scheme', () => {
    const d = designMember({ ...sheetDesignInput(girder, plan.designBasis, plan.members.find((m) => m.id === 'gA12')), shape: girder.design!.shape });
    expect(d.shape).toBe(girder.design!.shape);
    expect(d.ratio).toBeCloseTo(girder.design!.ratio, 12);
    expect(d.checks.map((c) => c.demand)).toEqual(girder.design!.checks.map((c) => expect.closeTo(c.demand, 10)));
  });

  it('when shown, then every check has a row with its clause, equation, combination and printed ratio; the governing one says "Governs"', () => {
    renderSheet();
    const design = girder.design!;
    expect(design.checks.length).toBe(4);
    for (const check of design.checks) {
      const row = document.querySelector<HTMLElement>(`tr[data-check="${check.name}"]`)!;
      expect(row, check.name).not.toBeNull();
      const r = within(row);
      expect(r.getByText(check.clause)).toBeInTheDocument();
      expect(r.getByText(check.equation)).toBeInTheDocument();
      expect(r.getByText(check.combination)).toBeInTheDocument();
      expect(r.getByText(formatRatio(check.ratio))).toBeInTheDocument();
      if (check.name === design.governing) {
        expect(r.getByText('Governs')).toBeInTheDocument();
        expect(row).toHaveAttribute('aria-current', 'true');
      } else {
        expect(r.queryByText('Governs')).not.toBeInTheDocument();
      }
    }
    // gA12 is governed by lateral-torsional buckling in its middle segment (Lb = 10 ft between beams).
    expect(design.governing).toBe('flexure');
  });

  it('when shown, then each load is listed with where it came from', () => {
    renderSheet();
    for (const load of girder.loads) expect(screen.getAllByText(load.source!).length).toBeGreaterThan(0);
    expect(screen.getAllByText(/beam b2 reaction/).length).toBeGreaterThan(0);
  });

  it('when shown, then the moment and shear maxima are labelled and agree with closed forms (AISC Manual Part 3)', () => {
    renderSheet();
    // Two equal point loads at the third points (M = P·a between them) plus uniform self weight
    // (wL²/8), 1.2D + 1.6L (ASCE 7-16 §2.3.1), worked by hand from the member's own loads.
    const sum = (c: 'D' | 'L', x: number) =>
      girder.loads.filter((l) => l.case === c && l.kind === 'point' && l.x_ft === x).reduce((s, l) => s + (l.kind === 'point' ? l.P_kip : 0), 0);
    const pu = 1.2 * sum('D', 10) + 1.6 * sum('L', 10);
    const wu = 1.2 * girder.design!.selfWeight_klf;
    const muHand = pu * 10 + (wu * 30 * 30) / 8;
    const vuHand = pu + (wu * 30) / 2;
    expect(sum('D', 10)).toBeCloseTo(sum('D', 20), 9);
    expect(muHand).toBeCloseTo(girder.design!.maxMoment.M_kipft, 6);
    const moment = screen.getByRole('img', { name: /^Moment M, 1\.2D\+1\.6L/ });
    expect(moment).toHaveAccessibleName(expect.stringContaining(`max M ${formatQuantity('moment_kipft', muHand, 'US')} at 15.00 ft`));
    const shear = screen.getByRole('img', { name: /^Shear V/ });
    expect(shear).toHaveAccessibleName(expect.stringContaining(`max |V| ${formatQuantity('force_kip', vuHand, 'US')}`));
    const defl = screen.getByRole('img', { name: /^Deflected shape, service D\+L/ });
    expect(defl).toHaveAccessibleName(expect.stringContaining(`max Δ ${formatQuantity('length_in', girder.design!.deflectionTotal_in, 'US')}`));
  });

  it('when SI is chosen, then the same maxima are printed in kN·m and kN', () => {
    renderSheet({ units: 'SI' });
    const m = girder.design!.maxMoment.M_kipft;
    expect(screen.getByRole('img', { name: /^Moment M/ })).toHaveAccessibleName(expect.stringContaining(`${(m * 1.3558179483314004).toFixed(1)} kN·m at 4.572 m`));
  });

  it('when shown, then every unbraced segment appears with its Lb and Cb and the governing one is marked', () => {
    renderSheet();
    const segs = girder.design!.segments;
    expect(segs.length).toBe(3); // braced at the beams at 10 and 20 ft
    for (let i = 0; i < segs.length; i++) {
      const row = document.querySelector<HTMLElement>(`tr[data-segment="${i}"]`)!;
      expect(within(row).getByText(segs[i].Cb.toFixed(2))).toBeInTheDocument();
      expect(within(row).getByText('10.00 ft')).toBeInTheDocument();
    }
    expect(within(document.querySelector<HTMLElement>('tr[data-segment="1"]')!).getByText('Governs')).toBeInTheDocument();
  });

  it('when the flexure working is opened, then Lp, Lr, Lb, Cb, Mp and Mn are shown with their equations', async () => {
    renderSheet();
    const button = screen.getByRole('button', { name: 'Show steps for Flexure' });
    expect(button).toHaveAttribute('aria-expanded', 'false');
    // "Working" is the name of a ratio band; no control of the checks table uses it.
    expect(screen.queryAllByRole('button', { name: /working/i })).toEqual([]);
    await userEvent.click(button);
    expect(screen.getByRole('button', { name: 'Hide steps for Flexure' })).toHaveAttribute('aria-expanded', 'true');
    const flex = girder.design!.checks.find((c) => c.name === 'flexure')!;
    const working = document.getElementById('working-flexure')!;
    const w = within(working);
    expect(w.getByText(formatQuantity('length_ft', flex.Lp_ft!, 'US'))).toBeInTheDocument();
    expect(w.getByText('Eq. F2-5')).toBeInTheDocument();
    expect(w.getByText(formatQuantity('length_ft', flex.Lr_ft!, 'US'))).toBeInTheDocument();
    expect(w.getByText('Eq. F2-6')).toBeInTheDocument();
    expect(w.getByText(formatQuantity('moment_kipft', flex.Mp_kipft!, 'US'))).toBeInTheDocument();
    expect(w.getByText(formatQuantity('moment_kipft', flex.Mn_kipft!, 'US'))).toBeInTheDocument();
    expect(w.getByText(flex.Cb!.toFixed(3))).toBeInTheDocument();
    expect(w.getByText('0.90')).toBeInTheDocument(); // φb = 0.90, AISC 360-16 F1 (common practice)
  });

  it('when shown, then the next lighter and next shallower shapes carry the engine ratios', () => {
    renderSheet();
    const input = sheetDesignInput(girder, plan.designBasis, plan.members.find((m) => m.id === 'gA12'));
    const alt = memberAlternatives(input, girder.design!.shape);
    expect(alt.nextLighter).not.toBeNull();
    const lighter = document.querySelector<HTMLElement>('tr[data-alternative="Next lighter"]')!;
    expect(within(lighter).getByText(alt.nextLighter!.shape)).toBeInTheDocument();
    expect(within(lighter).getByText(formatRatio(alt.nextLighter!.ratio))).toBeInTheDocument();
    const shallower = document.querySelector<HTMLElement>('tr[data-alternative="Next shallower"]')!;
    if (alt.nextShallower) {
      expect(within(shallower).getByText(alt.nextShallower.shape)).toBeInTheDocument();
      expect(within(shallower).getByText(formatRatio(alt.nextShallower.ratio))).toBeInTheDocument();
      expect(Number(alt.nextShallower.shape.slice(1).split('X')[0])).toBeLessThan(21);
    } else {
      expect(within(shallower).getByText(/No shallower shape passes/)).toBeInTheDocument();
    }
  });

  it('when the engineer picks W24X55 and locks, then onLockShape receives "W24X55"', async () => {
    const props = renderSheet();
    const select = screen.getByLabelText('Shape to lock');
    await userEvent.selectOptions(select, 'W24X55');
    // The preview is W24X55 designed for this member by the engine.
    const preview = designMember({ ...sheetDesignInput(girder, plan.designBasis, null), shape: 'W24X55' });
    expect(screen.getByText(/If locked,/).parentElement).toHaveTextContent(formatRatio(preview.ratio));
    await userEvent.click(screen.getByRole('button', { name: 'Lock size' }));
    expect(props.onLockShape).toHaveBeenCalledWith('W24X55');
  });

  it('when no shape is chosen, then Lock says so beside the select and calls nothing', async () => {
    const props = renderSheet();
    await userEvent.selectOptions(screen.getByLabelText('Shape to lock'), '');
    await userEvent.click(screen.getByRole('button', { name: 'Lock size' }));
    expect(screen.getByLabelText('Shape to lock')).toHaveAccessibleDescription('Choose a shape to lock');
    expect(props.onLockShape).not.toHaveBeenCalled();
  });

  it('when the plan has the size locked, then the sheet says so and Unlock calls onLockShape(null)', async () => {
    const locked = { ...plan.members.find((m) => m.id === 'gA12')!, shape: 'W21X48' };
    const props = renderSheet({ planMember: locked });
    expect(screen.getByText('locked')).toBeInTheDocument();
    await userEvent.click(screen.getByRole('button', { name: 'Unlock' }));
    expect(props.onLockShape).toHaveBeenCalledWith(null);
  });

  it('when a maximum depth of 18 in is applied, then onConstraints receives it in inches with the others blank', async () => {
    const props = renderSheet();
    await userEvent.type(screen.getByLabelText(/Maximum depth d \(in\)/), '18');
    await userEvent.click(screen.getByRole('button', { name: 'Apply constraints' }));
    await waitFor(() => expect(props.onConstraints).toHaveBeenCalledWith({ maxDepth_in: 18, minDepth_in: null, allowedNominalDepths: null }));
  });

  it('when SI is shown, then a depth typed in mm is passed on in inches', async () => {
    const props = renderSheet({ units: 'SI' });
    await userEvent.type(screen.getByLabelText(/Maximum depth d \(mm\)/), '533.4');
    await userEvent.type(screen.getByLabelText(/Nominal depths allowed/), 'W18, 21');
    await userEvent.click(screen.getByRole('button', { name: 'Apply constraints' }));
    await waitFor(() => expect(props.onConstraints).toHaveBeenCalledTimes(1));
    const c = vi.mocked(props.onConstraints).mock.calls[0][0];
    expect(c.maxDepth_in).toBeCloseTo(21, 12); // 533.4 mm / 25.4 (exact, NIST SP 811)
    expect(c.allowedNominalDepths).toEqual([18, 21]);
  });

  it('when constraints are inconsistent, then each field says why and nothing is sent', async () => {
    const props = renderSheet();
    await userEvent.type(screen.getByLabelText(/Maximum depth d/), '12');
    await userEvent.type(screen.getByLabelText(/Minimum depth d/), '16');
    await userEvent.type(screen.getByLabelText(/Nominal depths allowed/), '17');
    await userEvent.click(screen.getByRole('button', { name: 'Apply constraints' }));
    await waitFor(() => expect(screen.getByLabelText(/Nominal depths allowed/)).toHaveAccessibleDescription(/"17" is not a W-shape nominal depth/));
    expect(props.onConstraints).not.toHaveBeenCalled();
    await userEvent.clear(screen.getByLabelText(/Nominal depths allowed/));
    await userEvent.click(screen.getByRole('button', { name: 'Apply constraints' }));
    await waitFor(() => expect(screen.getByLabelText(/Minimum depth d/)).toHaveAccessibleDescription('Minimum depth is more than the maximum depth'));
    await userEvent.clear(screen.getByLabelText(/Minimum depth d/));
    await userEvent.clear(screen.getByLabelText(/Maximum depth d/));
    await userEvent.type(screen.getByLabelText(/Maximum depth d/), '3');
    await userEvent.click(screen.getByRole('button', { name: 'Apply constraints' }));
    // The shallowest W-shape in AISC Shapes Database v15.0 is W4X13, d = 4.16 in.
    await waitFor(() => expect(screen.getByLabelText(/Maximum depth d/)).toHaveAccessibleDescription('No W-shape in the catalog fits these limits together'));
    expect(props.onConstraints).not.toHaveBeenCalled();
  });

  it('when the role cannot edit, then there is no lock, unlock or constraint control, only the summary', () => {
    renderSheet({ canEdit: false, planMember: { ...plan.members.find((m) => m.id === 'gA12')!, maxDepth_in: 21 } });
    expect(screen.queryByLabelText('Shape to lock')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Lock size/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Unlock' })).not.toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Depth constraints' })).not.toBeInTheDocument();
    expect(screen.getByText(/Constraints: d ≤ 21.00 in\./)).toBeInTheDocument();
    // Results stay readable.
    expect(document.querySelectorAll('tr[data-check]').length).toBe(4);
  });

  it('when Close is pressed, then onClose is called; the engineer caution is the last part of the sheet', async () => {
    const props = renderSheet();
    await userEvent.click(screen.getByRole('button', { name: 'Close member sheet' }));
    expect(props.onClose).toHaveBeenCalledTimes(1);
    const aside = screen.getByRole('complementary', { name: /Member sheet/ });
    const footer = aside.querySelector('footer')!;
    expect(footer).toHaveTextContent(/licensed engineer, who must check them/);
    expect(footer).toHaveTextContent(/engineer of record govern/);
    expect(aside.lastElementChild).toBe(footer);
  });

  it('when a beam with continuous bracing is shown, then it has one segment with Lb 0 and Cb 1.00', () => {
    const beam = scheme.members.find((m) => m.id === 'b5')!;
    renderSheet({ member: beam, planMember: plan.members.find((m) => m.id === 'b5') });
    expect(beam.design!.segments).toHaveLength(1);
    const row = document.querySelector<HTMLElement>('tr[data-segment="0"]')!;
    expect(within(row).getByText('1.00')).toBeInTheDocument(); // Cb = 1.0, continuous bracing (calc-interface.md)
    expect(within(row).getAllByText('0.00 ft').length).toBeGreaterThan(0);
    expect(screen.getByText(/braced continuously/)).toBeInTheDocument();
  });
});
