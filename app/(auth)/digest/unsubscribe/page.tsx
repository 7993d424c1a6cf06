import type { Metadata } from "next";
import { UnsubscribeConfirm } from "@/components/digest/unsubscribe-confirm";
import { Notice } from "@/components/ui/notice";
import { describeUnsubscribe, type UnsubscribeResult } from "@/lib/digest/recipients";
import { AppError } from "@/lib/errors";

export const metadata: Metadata = { title: "Daily digest", robots: { index: false, follow: false } };
export const dynamic = "force-dynamic";

// Public: the signed token in the link is the authority, no sign-in. Opening the page changes
// nothing (mail scanners open links); the button confirms.
export default async function UnsubscribePage({ searchParams }: { searchParams: Promise<{ token?: string | string[] }> }) {
  const { token } = await searchParams;
  const value = typeof token === "string" ? token : null;
  let info: UnsubscribeResult;
  try {
    info = await describeUnsubscribe(value);
  } catch (error) {
    if (error instanceof AppError) {
      return (
        <Notice tone="danger" title="This unsubscribe link is not valid." testId="unsubscribe-invalid">
          It may have been changed or cut short. Use the link at the bottom of a recent digest e-mail, or ask the project office to take you off the list.
        </Notice>
      );
    }
    throw error;
  }
  return (
    <section className="card flex flex-col gap-4 p-5" aria-labelledby="unsubscribe-title">
      <h1 id="unsubscribe-title" className="text-xl font-bold text-ink-950">
        Daily digest of {info.projectName}
      </h1>
      <UnsubscribeConfirm token={value!} email={info.email} projectName={info.projectName} alreadyUnsubscribed={info.alreadyUnsubscribed} />
    </section>
  );
}
