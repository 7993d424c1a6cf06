import clsx from "clsx";
import { CircleAlert, Info, OctagonAlert, CircleCheck } from "lucide-react";

type Tone = "info" | "success" | "caution" | "danger";

const TONES: Record<Tone, { box: string; icon: typeof Info; label: string }> = {
  info: { box: "border-ink-300 bg-white text-ink-900", icon: Info, label: "Note" },
  success: { box: "border-lichen-600 bg-lichen-50 text-lichen-900", icon: CircleCheck, label: "Done" },
  caution: { box: "border-caution-600 bg-caution-50 text-caution-800", icon: CircleAlert, label: "Caution" },
  danger: { box: "border-danger-600 bg-danger-50 text-danger-800", icon: OctagonAlert, label: "Warning" },
};

/** A message with an icon and a word for its tone: never colour alone. */
export function Notice({
  tone = "info",
  title,
  children,
  className,
  testId,
}: {
  tone?: Tone;
  title?: string;
  children?: React.ReactNode;
  className?: string;
  testId?: string;
}) {
  const { box, icon: Icon, label } = TONES[tone];
  return (
    <div
      role={tone === "danger" || tone === "caution" ? "alert" : "status"}
      data-testid={testId}
      className={clsx("flex gap-3 rounded-lg border-2 p-3", box, className)}
    >
      <Icon className="mt-0.5 h-5 w-5 shrink-0" aria-hidden="true" />
      <div className="min-w-0">
        <p className="font-semibold">
          <span className="sr-only">{label}: </span>
          {title}
        </p>
        {children ? <div className="mt-1 text-sm">{children}</div> : null}
      </div>
    </div>
  );
}
