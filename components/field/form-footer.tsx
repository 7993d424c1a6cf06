import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

/** The end of every field form: why the last save failed (if it did), Save and Cancel. */
export function FormFooter({
  failure,
  saveLabel,
  saveTestId,
  submitting,
  onCancel,
}: {
  failure: string | null | undefined;
  saveLabel: string;
  saveTestId: string;
  submitting: boolean;
  onCancel: () => void;
}) {
  return (
    <>
      {failure ? (
        <Notice tone="danger" title="Not saved" className="sm:col-span-2">
          {failure}
        </Notice>
      ) : null}
      <div className="flex gap-2 sm:col-span-2">
        <Button type="submit" data-testid={saveTestId} disabled={submitting}>
          {saveLabel}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </>
  );
}
