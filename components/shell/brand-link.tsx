import clsx from "clsx";
import Link from "next/link";
import { LogoMark } from "@/components/brand/logo-mark";

/** The mark and name at the left of both shells' headers, linking to the shell's home. */
export function BrandLink({ href, className }: { href: string; className?: string }) {
  return (
    <Link href={href} className={clsx("flex items-center gap-2", className)} aria-label="Placewright, today">
      <LogoMark className="h-9 w-9" />
      <span className="hidden text-lg font-bold tracking-tight sm:inline">Placewright</span>
    </Link>
  );
}
