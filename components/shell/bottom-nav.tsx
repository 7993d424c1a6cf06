"use client";

import clsx from "clsx";
import type { LucideIcon } from "lucide-react";
import Link from "next/link";

export type NavItem = { href: string; label: string; icon: LucideIcon };

/** The phone's bottom navigation: big targets under the thumb, the current place marked. */
export function BottomNav({
  label,
  items,
  isActive,
  className,
  testIdPrefix,
}: {
  label: string;
  items: NavItem[];
  isActive: (href: string) => boolean;
  className?: string;
  testIdPrefix?: string;
}) {
  return (
    <nav
      aria-label={label}
      className={clsx("no-print fixed inset-x-0 bottom-0 z-20 grid border-t border-ink-200 bg-white", className)}
      style={{ gridTemplateColumns: `repeat(${items.length}, minmax(0, 1fr))` }}
    >
      {items.map(({ href, label: itemLabel, icon: Icon }) => (
        <Link
          key={href}
          href={href}
          // No prefetch: in view on every screen, it would fetch every other screen's code with the
          // first load. Offline, the service worker answers the click from its precache.
          prefetch={false}
          data-testid={testIdPrefix ? `${testIdPrefix}${itemLabel.toLowerCase().replace(/\s+/g, "-")}` : undefined}
          aria-current={isActive(href) ? "page" : undefined}
          className={clsx(
            "flex min-h-16 flex-col items-center justify-center gap-1 text-xs font-semibold",
            isActive(href) ? "text-lichen-700" : "text-ink-600",
          )}
        >
          <Icon className="h-6 w-6" aria-hidden="true" />
          {itemLabel}
        </Link>
      ))}
    </nav>
  );
}
