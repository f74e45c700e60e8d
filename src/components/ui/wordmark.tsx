/**
 * Gatefold's own logotype: a gate outline folded along its middle (two facing half-shapes, one
 * lit amber as a high signal, one slate as a low) beside the name in the mono face.
 */
export function Wordmark({ className }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 ${className ?? ''}`}>
      <svg width="26" height="20" viewBox="0 0 26 20" aria-hidden="true">
        <path d="M2 3h7a7 7 0 0 1 0 14H2z" fill="none" stroke="#ffb347" strokeWidth="2" strokeLinejoin="round" />
        <path d="M24 3h-5" stroke="#5b7a99" strokeWidth="2" strokeLinecap="round" />
        <path d="M24 17h-5" stroke="#5b7a99" strokeWidth="2" strokeLinecap="round" />
        <path d="M13 1v18" stroke="#5b7a99" strokeWidth="1.5" strokeDasharray="2 2" />
      </svg>
      <span className="font-mono text-[15px] font-semibold tracking-tight text-slate-100">
        gate<span className="text-amber-glow">fold</span>
      </span>
    </span>
  );
}
