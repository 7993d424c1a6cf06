"use client";

// Starting a visit report asks which project first: only the projects where the person may write
// visits (lib/auth/can through visit-model), the one shown preselected, or the only one. The date is
// today on that project's clock, not the device's.
import { Plus } from "lucide-react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { useDeviceWrite } from "@/components/field/use-device-write";
import { createLocal, type ProjectRow } from "@/lib/sync/client";
import { useSyncDb } from "@/lib/sync/client/react";
import { preselectedProject, projectToday, visitProjects } from "./visit-model";

export function NewVisit({ projects, shownId }: { projects: ProjectRow[]; shownId: string | null }) {
  const db = useSyncDb();
  const router = useRouter();
  const writable = visitProjects(projects);
  const [open, setOpen] = useState(false);
  const [projectId, setProjectId] = useState("");
  const { error, run } = useDeviceWrite();
  if (writable.length === 0) return null;
  if (!open) {
    return (
      <Button
        data-testid="new-visit"
        onClick={() => {
          setProjectId(preselectedProject(writable, shownId));
          setOpen(true);
        }}
      >
        <Plus className="h-5 w-5" aria-hidden="true" /> New visit
      </Button>
    );
  }
  const start = () =>
    run(async () => {
      const project = writable.find((p) => p.id === projectId);
      if (!project) throw new Error("Choose the project this visit is on.");
      const { id } = await createLocal(db, "site-visits", project.id, { visitDate: projectToday(project.timeZone) });
      router.push(`/field/visit?id=${id}`);
    });
  return (
    <form
      className="card flex w-full min-w-0 flex-col gap-3 p-4 sm:w-96"
      data-testid="new-visit-form"
      onSubmit={(e) => {
        e.preventDefault();
        void start();
      }}
    >
      <Select label="Which project is this visit on?" value={projectId} onChange={(e) => setProjectId(e.target.value)} data-testid="new-visit-project">
        <option value="">Choose a project</option>
        {writable.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </Select>
      {error ? (
        <Notice tone="danger" title="Not started" testId="new-visit-error">
          {error}
        </Notice>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" data-testid="start-visit">
          Start the visit report
        </Button>
        <Button variant="secondary" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
