/** The Bandgate mark: a gate (two copper posts and a lintel) that two crossing bands pass through. */
export function BrandMark({ size = 32, title = "Bandgate" }: { size?: number; title?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 64 64" role="img" aria-label={title}>
      <rect x="3" y="3" width="58" height="58" rx="14" fill="#27221c" />
      <path d="M14 50 V18 M50 50 V18" stroke="#a9582b" strokeWidth="5" strokeLinecap="round" />
      <path d="M14 18 H50" stroke="#a9582b" strokeWidth="3" strokeLinecap="round" />
      <path d="M8 40 C 20 40, 24 26, 32 26 S 44 40, 56 40" fill="none" stroke="#f6f1e6" strokeWidth="3.2" strokeLinecap="round" />
      <path
        d="M8 30 C 20 30, 24 44, 32 44 S 44 30, 56 30"
        fill="none"
        stroke="#f6f1e6"
        strokeWidth="1.8"
        strokeLinecap="round"
        strokeDasharray="3 3.5"
      />
    </svg>
  );
}
