import type { SheetDocument, SheetFill, SheetFont, SheetPrimitive, SheetTone } from '../../../../shared/drafting/sheet-primitives.drafting';

// Draws a sheet model (shared/drafting) as SVG: the same primitives the PDF draws, in the
// app's own fonts (Inter, JetBrains Mono), on white paper like the printed sheet.

const INK = '#000';
const SOFT = '#5a5f64';
const tone = (t: SheetTone | undefined) => (t === 'soft' ? SOFT : INK);
const fill = (f: SheetFill) => (f === 'ink' ? INK : f === 'paper' ? '#fff' : 'none');
const FONTS: Record<SheetFont, { family: string; weight: number }> = {
  sans: { family: '"Inter Variable", Inter, sans-serif', weight: 400 },
  'sans-bold': { family: '"Inter Variable", Inter, sans-serif', weight: 600 },
  mono: { family: '"JetBrains Mono Variable", "JetBrains Mono", monospace', weight: 400 },
  'mono-bold': { family: '"JetBrains Mono Variable", "JetBrains Mono", monospace', weight: 700 },
};

function Primitive({ p }: { p: SheetPrimitive }) {
  switch (p.type) {
    case 'line':
      return (
        <line
          x1={p.x1} y1={p.y1} x2={p.x2} y2={p.y2}
          stroke={tone(p.tone)} strokeWidth={p.weight} strokeDasharray={p.dash?.join(' ')}
          data-member={p.ref}
        />
      );
    case 'polygon':
      return p.closed ? (
        <polygon points={p.points.map((q) => q.join(',')).join(' ')} fill={fill(p.fill)} stroke={tone(p.tone)} strokeWidth={p.weight} />
      ) : (
        <polyline points={p.points.map((q) => q.join(',')).join(' ')} fill={fill(p.fill)} stroke={tone(p.tone)} strokeWidth={p.weight} />
      );
    case 'circle':
      return <circle cx={p.cx} cy={p.cy} r={p.r} fill={fill(p.fill)} stroke={tone(p.tone)} strokeWidth={p.weight} />;
    case 'rect':
      return <rect x={p.x} y={p.y} width={p.w} height={p.h} fill={fill(p.fill)} stroke={tone(p.tone)} strokeWidth={p.weight} />;
    case 'text': {
      const f = FONTS[p.font];
      return (
        <text
          x={p.x} y={p.y} fontSize={p.size} fontFamily={f.family} fontWeight={f.weight} fill={tone(p.tone)}
          textAnchor={p.anchor} transform={p.rotate ? `rotate(${p.rotate} ${p.x} ${p.y})` : undefined}
          style={{ fontVariantNumeric: 'tabular-nums' }}
        >
          {p.text}
        </text>
      );
    }
  }
}

export function SheetSvg({ sheet, title }: { sheet: SheetDocument; title: string }) {
  return (
    <svg
      role="img"
      aria-label={title}
      viewBox={`0 0 ${sheet.width_pt} ${sheet.height_pt}`}
      className="h-auto w-full bg-white shadow-[0_1px_0_rgba(0,0,0,0.2)]"
      data-testid="plan-sheet-svg"
    >
      <title>{title}</title>
      <rect x={0} y={0} width={sheet.width_pt} height={sheet.height_pt} fill="#fff" />
      {sheet.primitives.map((p, i) => (
        <Primitive key={i} p={p} />
      ))}
    </svg>
  );
}
