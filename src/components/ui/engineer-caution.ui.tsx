import { createContext, useContext, type ReactNode } from 'react';

/**
 * Set by a page frame whose footer carries the caution (the signed-in shell, the public
 * layout): inside it, a screen's own EngineerCaution renders nothing, so a screen shows the
 * caution once, in its footer. A component shown on its own (a test, a printed sheet) keeps
 * its own.
 */
const FooterCarriesCaution = createContext(false);

export function CautionInFooter({ children }: { children: ReactNode }) {
  return <FooterCarriesCaution.Provider value={true}>{children}</FooterCarriesCaution.Provider>;
}

/** The caution carried by every page: Baywright aids a licensed engineer, it does not replace one. */
export function EngineerCaution({ className = '', footer = false }: { className?: string; /** The frame's footer: always shown. */ footer?: boolean }) {
  const inFrame = useContext(FooterCarriesCaution);
  if (inFrame && !footer) return null;
  return (
    <p className={`text-xs leading-relaxed text-ink-soft ${className}`}>
      <strong className="font-semibold text-ink">Caution.</strong> Baywright's results are an aid to a
      licensed engineer, who must check them. The local building code and the engineer of record govern.
    </p>
  );
}
