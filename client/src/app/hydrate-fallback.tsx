import { BondmarkMark } from '@client/components/ui/wordmark';

/** Shown once, while the first page's loaders run (usually a single /me request). */
export function HydrateFallback() {
  return (
    <div className="flex min-h-screen items-center justify-center" role="status" aria-live="polite">
      <div className="flex items-center gap-3 text-graphite">
        <BondmarkMark size={28} className="skeleton bg-transparent" />
        <span>Loading Bondmark…</span>
      </div>
    </div>
  );
}
