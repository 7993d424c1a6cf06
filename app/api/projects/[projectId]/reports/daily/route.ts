import { projectRoute } from "@/lib/api/project-route";
import { buildDailyReport } from "@/lib/reports/daily";

type Params = { projectId: string };

/** The day's PDF report: ?date=YYYY-MM-DD (project-local date); any member of the project. */
export const GET = projectRoute<Params>({ action: "report.export" }, async ({ req, access }) => {
  const { pdf, filename } = await buildDailyReport(access, req.nextUrl.searchParams.get("date"));
  return new Response(Buffer.from(pdf), {
    headers: { "content-type": "application/pdf", "content-disposition": `inline; filename="${filename}"`, "cache-control": "private, no-store" },
  });
});
