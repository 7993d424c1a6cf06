import { db } from "@/db";
import { projectRoute } from "@/lib/api/project-route";
import { findingsToAcknowledge } from "@/lib/signoff/acknowledge";

type Params = { projectId: string; id: string };

/** The rulebook's cautions and warnings on the placement, as the server judges them (the sign-off asks for each). */
export const GET = projectRoute<Params>({ action: "project.read" }, ({ project, params }) => findingsToAcknowledge(db, project, params.id));
