import type { ReactNode } from 'react';

/** Any number on screen: monospaced face, tabular figures. */
export function Num({ children, className = '' }: { children: ReactNode; className?: string }) {
  return <span className={`num ${className}`}>{children}</span>;
}
