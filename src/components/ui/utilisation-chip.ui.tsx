import { utilisation } from '../../lib/utilisation';

/** A ratio with its band colour and words: the number is always printed. */
export function UtilisationChip({ ratio, showLabel = true }: { ratio: number; showLabel?: boolean }) {
  const u = utilisation(ratio);
  return (
    <span
      className="figures inline-flex items-center gap-1.5 rounded-[3px] px-1.5 py-0.5 font-mono text-xs"
      style={{ backgroundColor: u.colour, color: u.inkColour }}
      title={`Utilisation ${u.printed} (${u.label})`}
    >
      <span>{u.printed}</span>
      {showLabel ? <span className="font-sans">{u.label}</span> : null}
    </span>
  );
}
