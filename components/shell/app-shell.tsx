"use client";

import clsx from "clsx";
import { CalendarDays, FlaskConical, FolderKanban, Gauge, HardHat, ShieldCheck, TableProperties } from "lucide-react";
import Link from "next/link";
import { usePathname } from "next/navigation";
import { SyncProvider } from "@/lib/sync/client/react";
import type { UserProject } from "@/lib/users/queries";
import { BrandLink } from "./brand-link";
import { ContrastToggle } from "./contrast-toggle";
import { ProjectSwitcher } from "./project-switcher";
import { SyncStatus } from "./sync-status";
import { BottomNav } from "./bottom-nav";
import type { ShellUser } from "./shell-user";
import { UserMenu } from "./user-menu";


const NAV = [
  { href: "/today", label: "Today", icon: CalendarDays },
  { href: "/field/today", label: "Field", icon: HardHat },
  { href: "/projects", label: "Projects", icon: FolderKanban },
  { href: "/tools/evaporation", label: "Calculator", icon: Gauge },
];

/** Dense desktop tables: reached from the project page on a phone, not from the bottom bar. */
const DESK_ONLY = new Set(["/review", "/lab"]);

export function AppShell({ user, projects, children }: { user: ShellUser; projects: UserProject[]; children: React.ReactNode }) {
  const pathname = usePathname();
  // The office review is for the roles that reconcile or read what the field sent; the lab queue
  // for the people who make and break cylinders.
  const roles = new Set(projects.map((p) => p.role));
  const reviews = roles.has("office") || roles.has("inspector") || roles.has("owner");
  const lab = roles.has("office") || roles.has("inspector");
  const withReview = reviews ? [...NAV.slice(0, 3), { href: "/review", label: "Review", icon: TableProperties }, ...NAV.slice(3)] : NAV;
  const withLab = lab ? [...withReview, { href: "/lab", label: "Lab", icon: FlaskConical }] : withReview;
  const nav = user.isAdmin ? [...withLab, { href: "/admin", label: "Admin", icon: ShieldCheck }] : withLab;
  // The most specific section wins: a project's lab page (/projects/<id>/lab) is the Lab, not Projects.
  const section = (path: string) => (/^\/projects\/[^/]+\/lab(\/|$)/.test(path) ? "/lab" : path);
  const isActive = (href: string) => {
    const path = section(pathname);
    return path === href || path.startsWith(`${href}/`);
  };

  return (
    <SyncProvider identity={user}>
      <div className="flex min-h-dvh flex-col">
        <header className="no-print sticky top-0 z-20 border-b border-ink-800 bg-ink-900 text-white">
          <div className="mx-auto flex max-w-7xl items-center gap-3 px-3 py-2 lg:px-6">
            <BrandLink href="/today" />
            <ProjectSwitcher projects={projects} />
            <nav aria-label="Main" className="ml-2 hidden items-center gap-1 md:flex">
              {nav.map(({ href, label }) => (
                <Link
                  key={href}
                  href={href}
                  aria-current={isActive(href) ? "page" : undefined}
                  className={clsx(
                    "rounded-md px-3 py-2 text-sm font-semibold",
                    isActive(href) ? "bg-white/15 text-white" : "text-ink-200 hover:bg-white/10 hover:text-white",
                  )}
                >
                  {label}
                </Link>
              ))}
            </nav>
            <div className="ml-auto flex items-center gap-1">
              <SyncStatus />
              <ContrastToggle />
              <UserMenu user={user} />
            </div>
          </div>
        </header>

        <main className="mx-auto w-full max-w-7xl flex-1 px-3 pb-28 pt-4 md:pb-10 lg:px-6">{children}</main>

        {/* Phone: the main places sit under the thumb. */}
        <BottomNav label="Main" items={nav.filter((item) => !DESK_ONLY.has(item.href))} isActive={isActive} className="md:hidden" />
      </div>
    </SyncProvider>
  );
}
