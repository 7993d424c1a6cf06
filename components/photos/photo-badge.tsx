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

/** A photo's state in words with an icon (never colour alone). */
export function PhotoStateBadge({ badge, className }: { badge: Badge; className?: string }) {
  const { icon: Icon, className: tone } = LOOK[badge.state];
  return (
    <span
      data-testid="photo-state"
      data-state={badge.state}
      title={badge.detail}
      className={clsx("inline-flex max-w-full items-center gap-1 rounded-full px-2 py-0.5 text-xs font-semibold shadow-sm", tone, className)}
    >
      <Icon className="h-3.5 w-3.5 shrink-0" aria-hidden="true" />
      <span className="truncate">{badge.label}</span>
    </span>
  );
}
