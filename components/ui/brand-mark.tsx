/** Sundocket's mark: a half sun rising over a docket rule. */
export function BrandMark({ size = 28 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect x="1" y="1" width="30" height="30" rx="2" fill="none" stroke="currentColor" strokeWidth="1.5" />
      <path d="M8 21a8 8 0 0 1 16 0" fill="none" stroke="currentColor" strokeWidth="2" />
      <g stroke="currentColor" strokeWidth="1.5" strokeLinecap="round">
        <line x1="16" y1="7" x2="16" y2="10" />
        <line x1="7.5" y1="11.5" x2="9.6" y2="13.6" />
        <line x1="24.5" y1="11.5" x2="22.4" y2="13.6" />
      </g>
      <line x1="5" y1="21" x2="27" y2="21" stroke="currentColor" strokeWidth="2" />
      <line x1="5" y1="25" x2="20" y2="25" stroke="currentColor" strokeWidth="1" />
    </svg>
  );
}
