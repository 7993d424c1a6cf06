import clsx from "clsx";
import { SEVERITY_WORDS, TONES, type IconName, type Word } from "@/lib/ui/vocabulary";
import { VocabularyIcon } from "./state-badge";

type Tone = "info" | "success" | "caution" | "danger";

// A notice's tone is a severity of the vocabulary (danger reads as Warning), so its word, colour and
// icon are those of every other surface; "success" is the vocabulary's done tone.
const TONE_WORDS: Record<Tone, Word> = {
  info: SEVERITY_WORDS.info,
  success: { label: "Done", tone: "done", icon: "circle-check" },
  caution: SEVERITY_WORDS.caution,
  danger: SEVERITY_WORDS.warning,
};

/** A message with an icon and a word for its tone: never colour alone. */
export function Notice({
  tone = "info",
  icon,
  title,
  children,
  className,
  testId,
}: {
  tone?: Tone;
  /** Another icon of the vocabulary, for a notice about one state (a hold shows the hold's icon). */
  icon?: IconName;
  title?: string;
  children?: React.ReactNode;
  className?: string;
  testId?: string;
}) {
  const word = TONE_WORDS[tone];
  return (
    <div
      role={tone === "danger" || tone === "caution" ? "alert" : "status"}
      data-testid={testId}
      data-tone={word.tone}
      className={clsx("flex gap-3 rounded-lg border-2 p-3", TONES[word.tone].className, className)}
    >
      <VocabularyIcon name={icon ?? word.icon} className="mt-0.5 h-5 w-5 shrink-0" />
      <div className="min-w-0">
        <p className="font-semibold">
          <span className="sr-only">{word.label}: </span>
          {title}
        </p>
        {children ? <div className="mt-1 text-sm">{children}</div> : null}
      </div>
    </div>
  );
}
