"use client";

// Small badges beside a value, in the words, icons and colours of lib/ui/vocabulary.
import clsx from "clsx";
import { VocabularyIcon } from "@/components/ui/state-badge";
import { SEVERITY_WORDS, TONES } from "@/lib/ui/vocabulary";

/** A small verdict beside a value: words + icon + colour. */
export function Verdict({ ok, okText = "In tolerance", badText = "Out of tolerance", testId }: { ok: boolean; okText?: string; badText?: string; testId?: string }) {
  // The colours and icons of the vocabulary: a pass in the done tone, a failure as a warning.
  const word = ok ? { tone: "done" as const, icon: "circle-check" as const } : SEVERITY_WORDS.warning;
  return (
    <span
      data-testid={testId}
      data-ok={ok ? "yes" : "no"}
      data-tone={word.tone}
      className={clsx("inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold", TONES[word.tone].className)}
    >
      <VocabularyIcon name={word.icon} />
      {ok ? okText : badText}
    </span>
  );
}

/** A caution in words, with the vocabulary's caution colour and icon. */
export function CautionBadge({ children, testId }: { children: React.ReactNode; testId?: string }) {
  const word = SEVERITY_WORDS.caution;
  return (
    <span data-testid={testId} data-tone={word.tone} className={clsx("inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold", TONES[word.tone].className)}>
      <VocabularyIcon name={word.icon} />
      {children}
    </span>
  );
}
