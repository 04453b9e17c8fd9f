/** The caution carried by every page: Baywright aids a licensed engineer, it does not replace one. */
export function EngineerCaution({ className = '' }: { className?: string }) {
  return (
    <p className={`text-xs leading-relaxed text-ink-soft ${className}`}>
      <strong className="font-semibold text-ink">Caution.</strong> Baywright's results are an aid to a
      licensed engineer, who must check them. The local building code and the engineer of record govern.
    </p>
  );
}
