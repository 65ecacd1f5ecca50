/**
 * Bondmark's mark: two overlapping atomic orbitals, the shared region filled —
 * the overlap that makes a bond. Drawn for this product.
 */
export function BondmarkMark({ size = 28, className = '' }: { size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false" className={className}>
      <path d="M16 9.072 A8 8 0 0 1 16 22.928 A8 8 0 0 1 16 9.072 Z" fill="var(--color-bonding)" />
      <circle cx="12" cy="16" r="8" fill="none" stroke="var(--color-ink)" strokeWidth="1.75" />
      <circle cx="20" cy="16" r="8" fill="none" stroke="var(--color-reference)" strokeWidth="1.75" />
    </svg>
  );
}

/** Mark and name together. The name is real text, so the accessible name is "Bondmark". */
export function Wordmark({ size = 'md' }: { size?: 'md' | 'lg' }) {
  const large = size === 'lg';
  return (
    <span className="inline-flex items-center gap-2 text-ink" data-testid="wordmark">
      <BondmarkMark size={large ? 44 : 26} />
      <span className={`font-serif font-semibold tracking-[-0.01em] ${large ? 'text-[2rem]' : 'text-[1.2rem]'}`}>
        Bondmark
      </span>
    </span>
  );
}
