import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis, ResponsiveContainer } from 'recharts';
import type { ComparisonScheme } from '../api/get-comparison.api';
import type { UnitSystem } from '../../../lib/units';
import { tonnageUnits } from './tonnage-units';

// Grouped bars, one colour per scheme (named in the legend and tooltip, never colour alone).
export const SCHEME_COLOURS = ['#1c2228', '#2b3fc2', '#b0792a', '#6b8f71'];

function shortName(name: string): string {
  return name.length > 28 ? `${name.slice(0, 26)}…` : name;
}

function ChartFrame({ title, children }: { title: string; children: React.ReactElement }) {
  return (
    <figure className="border border-ink/70 bg-paper-raised p-3">
      <figcaption className="label-caps mb-2 text-ink">{title}</figcaption>
      <div className="h-64 w-full">
        <ResponsiveContainer width="100%" height="100%">
          {children}
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

export function TonnageCharts({ schemes, system = 'US' }: { schemes: ComparisonScheme[]; system?: UnitSystem }) {
  const u = tonnageUnits(system);
  // Short tons (US) or tonnes (SI), to a tenth.
  const tons = (lb: number) => Math.round(u.big(lb) * 10) / 10;
  const designed = schemes.filter((s) => s.totals);
  if (designed.length === 0) return null;
  // Rows by level in the first scheme's order; a level only some schemes have shows 0 for the others.
  const levelNames: string[] = [];
  for (const s of designed) for (const l of s.byLevel ?? []) if (!levelNames.includes(l.levelName)) levelNames.push(l.levelName);
  const byLevel = levelNames.map((name) => {
    const row: Record<string, string | number> = { name };
    designed.forEach((s, i) => (row[`s${i}`] = tons(s.byLevel?.find((l) => l.levelName === name)?.steelWeight_lb ?? 0)));
    return row;
  });
  const byKind = (['girder', 'beam', 'column'] as const).map((kind) => {
    const row: Record<string, string | number> = { name: kind === 'girder' ? 'Girders' : kind === 'beam' ? 'Beams' : 'Columns' };
    designed.forEach((s, i) => (row[`s${i}`] = tons(s.byKind?.find((k) => k.kind === kind)?.steelWeight_lb ?? 0)));
    return row;
  });
  const bars = designed.map((s, i) => (
    <Bar key={s.id} dataKey={`s${i}`} name={shortName(s.name)} fill={SCHEME_COLOURS[i % SCHEME_COLOURS.length]} isAnimationActive={false} />
  ));
  const axes = [
    <CartesianGrid key="g" strokeDasharray="2 3" stroke="#cdc3ae" vertical={false} />,
    <XAxis key="x" dataKey="name" tick={{ fontSize: 11, fill: '#4a525a' }} />,
    <YAxis key="y" tick={{ fontSize: 11, fill: '#4a525a' }} label={{ value: u.bigUnit, angle: -90, position: 'insideLeft', fontSize: 11, fill: '#4a525a' }} />,
    <Tooltip key="t" formatter={(v) => `${v} ${u.bigUnit}`} />,
    <Legend key="l" wrapperStyle={{ fontSize: 12 }} />,
  ];
  return (
    <div className="grid gap-4 lg:grid-cols-2">
      <ChartFrame title={`Steel by level (${u.bigUnit})`}>
        <BarChart data={byLevel} margin={{ top: 4, right: 8, bottom: 4, left: 4 }}>
          {axes}
          {bars}
        </BarChart>
      </ChartFrame>
      <ChartFrame title={`Steel by kind (${u.bigUnit})`}>
        <BarChart data={byKind} margin={{ top: 4, right: 8, bottom: 4, left: 4 }}>
          {axes}
          {bars}
        </BarChart>
      </ChartFrame>
    </div>
  );
}
