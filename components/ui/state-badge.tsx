// The one way a screen shows a state or a severity: the word, the colour and the icon of
// lib/ui/vocabulary.ts (never colour alone). Server and client components can both render it.
import clsx from "clsx";
import {
  CircleAlert,
  CircleCheck,
  CircleX,
  ClipboardCheck,
  Clock,
  FileX,
  Hammer,
  Info,
  OctagonAlert,
  OctagonPause,
  PencilLine,
  Reply,
  Scale,
  Send,
  ShieldCheck,
  TriangleAlert,
  Truck,
  type LucideIcon,
} from "lucide-react";
import { TONES, wordFor, type IconName, type VocabularyKind } from "@/lib/ui/vocabulary";

export const ICONS: Record<IconName, LucideIcon> = {
  clock: Clock,
  "clipboard-check": ClipboardCheck,
  "circle-check": CircleCheck,
  truck: Truck,
  hammer: Hammer,
  "shield-check": ShieldCheck,
  "octagon-pause": OctagonPause,
  "circle-x": CircleX,
  "circle-alert": CircleAlert,
  "triangle-alert": TriangleAlert,
  "octagon-alert": OctagonAlert,
  info: Info,
  reply: Reply,
  "pencil-line": PencilLine,
  send: Send,
  "file-x": FileX,
  scale: Scale,
};

export function VocabularyIcon({ name, className }: { name: IconName; className?: string }) {
  const Icon = ICONS[name];
  return <Icon className={className ?? "h-4 w-4 shrink-0"} aria-hidden="true" />;
}

/**
 * A state or severity as a small pill: `<StateBadge kind="placement" code="held" />`.
 * `children` follow the word (a hold reason, a count); `size="lg"` for the heading of a record.
 */
export function StateBadge({
  kind,
  code,
  testId,
  size = "md",
  className,
  children,
}: {
  kind: VocabularyKind;
  code: string;
  testId?: string;
  size?: "sm" | "md" | "lg";
  className?: string;
  children?: React.ReactNode;
}) {
  const word = wordFor(kind, code);
  return (
    <span
      data-testid={testId}
      data-kind={kind}
      data-code={code}
      data-tone={word.tone}
      className={clsx(
        "inline-flex max-w-full items-center gap-1 rounded-full border font-semibold",
        size === "sm" && "px-1.5 py-0 text-xs",
        size === "md" && "px-2.5 py-0.5 text-sm",
        size === "lg" && "border-2 px-3 py-1 text-base",
        TONES[word.tone].className,
        className,
      )}
    >
      <VocabularyIcon name={word.icon} className={size === "lg" ? "h-5 w-5 shrink-0" : size === "sm" ? "h-3.5 w-3.5 shrink-0" : "h-4 w-4 shrink-0"} />
      <span data-part="label">{word.label}</span>
      {children}
    </span>
  );
}
