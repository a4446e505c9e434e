/** Tenderflow's mark: a piston in a bore, drawn as two nested strokes. */
export function Logo({ size = 26 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true">
      <rect x="2" y="9" width="20" height="14" rx="3" fill="none" stroke="#129b8a" strokeWidth="3" />
      <rect x="12" y="12" width="4" height="8" fill="#e08a0b" />
      <rect x="16" y="14.5" width="14" height="3" rx="1.5" fill="#e6eaef" />
    </svg>
  );
}
