import clsx from "clsx";
import { CloudCheck, CloudUpload, Hourglass, Smartphone, TriangleAlert } from "lucide-react";
import type { PhotoBadge as Badge } from "@/lib/photos/client/upload-state";

const LOOK: Record<Badge["state"], { icon: typeof CloudCheck; className: string }> = {
  stored: { icon: CloudCheck, className: "bg-lichen-50 text-lichen-900" },
  uploading: { icon: CloudUpload, className: "bg-white text-ink-900" },
  local: { icon: Smartphone, className: "bg-white text-ink-900" },
  failed: { icon: TriangleAlert, className: "bg-caution-100 text-caution-800" },
  elsewhere: { icon: Hourglass, className: "bg-ink-100 text-ink-900" },
};

/** A photo's state in words with an icon (never colour alone); `compact` for thumbnails, the full words stay for screen readers and as the tooltip. */
export function PhotoStateBadge({ badge, className, compact = false }: { badge: Badge; className?: string; compact?: boolean }) {
  const { icon: Icon, className: tone } = LOOK[badge.state];
  return (
    <span
      data-testid="photo-state"
      data-state={badge.state}
      title={badge.detail ? `${badge.label}: ${badge.detail}` : badge.label}
      className={clsx("inline-flex max-w-full items-center gap-1 rounded-full py-0.5 text-xs font-semibold shadow-sm", compact ? "px-1.5" : "px-2", tone, className)}
    >
      <Icon className="h-3.5 w-3.5 shrink-0" aria-hidden="true" />
      {compact && badge.short !== badge.label ? (
        <>
          <span className="truncate" aria-hidden="true">
            {badge.short}
          </span>
          <span className="sr-only">{badge.label}</span>
        </>
      ) : (
        <span className="truncate">{badge.label}</span>
      )}
    </span>
  );
}
