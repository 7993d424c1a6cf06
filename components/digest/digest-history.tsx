import { CircleCheck, Clock } from "lucide-react";
import { Table } from "@/components/ui/table";

export type HistoryItem = { key: string; date: string; recipientEmail: string; status: "sending" | "sent"; sentAt: string | null; by: string };

export function DigestHistory({ history }: { history: HistoryItem[] }) {
  return (
    <section className="card overflow-x-auto" aria-labelledby="digest-history">
      <h2 id="digest-history" className="px-4 pt-4 text-lg font-bold">History</h2>
      {history.length === 0 ? (
        <p className="p-4 text-muted" data-testid="digest-history-empty">No digest has been sent for this project yet.</p>
      ) : (
        <Table columns={["Day", "Recipient", "Status", "Sent", "How"]} testId="digest-history" className="mt-2">
            {history.map((h) => (
              <tr key={h.key} data-testid="digest-history-row">
                <td className="px-3 py-2 font-mono whitespace-nowrap">{h.date}</td>
                <td className="px-3 py-2">{h.recipientEmail}</td>
                <td className="px-3 py-2">
                  <span className="inline-flex items-center gap-1.5 font-semibold">
                    {h.status === "sent" ? <CircleCheck className="h-4 w-4" aria-hidden="true" /> : <Clock className="h-4 w-4" aria-hidden="true" />}
                    {h.status === "sent" ? "Sent" : "Sending"}
                  </span>
                </td>
                <td className="px-3 py-2 whitespace-nowrap">{h.sentAt ?? "—"}</td>
                <td className="px-3 py-2">{h.by}</td>
              </tr>
            ))}
          </Table>
      )}
    </section>
  );
}
