// Placewright's mark: three placed lifts of concrete under a plumb line, in ink and lichen.
import { paletteHex } from "@/lib/ui/palette";

export function LogoMark({ className = "h-8 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 64 64" className={className} aria-hidden="true" focusable="false">
      <rect width="64" height="64" rx="14" fill={paletteHex("ink-900")} />
      <rect x="12" y="38" width="40" height="10" rx="2" fill={paletteHex("lichen-500")} />
      <rect x="12" y="26" width="40" height="10" rx="2" fill={paletteHex("lichen-300")} />
      <rect x="12" y="14" width="26" height="10" rx="2" fill={paletteHex("lichen-100")} />
      <path d="M46 10v14" stroke={paletteHex("lichen-100")} strokeWidth="3" strokeLinecap="round" />
      <path d="M42 24h8l-4 6z" fill={paletteHex("lichen-100")} />
    </svg>
  );
}
