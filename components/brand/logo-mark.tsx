// Placewright's mark: three placed lifts of concrete under a plumb line, in ink and lichen.
export function LogoMark({ className = "h-8 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 64 64" className={className} aria-hidden="true" focusable="false">
      <rect width="64" height="64" rx="14" fill="#161d27" />
      <rect x="12" y="38" width="40" height="10" rx="2" fill="#23917f" />
      <rect x="12" y="26" width="40" height="10" rx="2" fill="#72cbba" />
      <rect x="12" y="14" width="26" height="10" rx="2" fill="#d3f1ea" />
      <path d="M46 10v14" stroke="#d3f1ea" strokeWidth="3" strokeLinecap="round" />
      <path d="M42 24h8l-4 6z" fill="#d3f1ea" />
    </svg>
  );
}
