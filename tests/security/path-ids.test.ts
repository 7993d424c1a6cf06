// Finding 10: path ids. Attack: probe every project route with a project the caller does not belong
// to, one that does not exist, and malformed ids, as a signed-in outsider. One policy: malformed → 400
// naming the parameter, foreign or missing → the same 404 (no existence oracle), never a 500; and
// nothing is written. [common practice: OWASP API Security Top 10 2023, API1 broken object level
// authorization, "return 404 rather than 403 for objects the caller may not know about"]
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import * as audit from "@/app/api/projects/[projectId]/audit/[recordId]/route";
import * as history from "@/app/api/projects/[projectId]/digest/history/route";
import * as preview from "@/app/api/projects/[projectId]/digest/preview/route";
import * as recipient from "@/app/api/projects/[projectId]/digest/recipients/[recipientId]/route";
import * as recipients from "@/app/api/projects/[projectId]/digest/recipients/route";
import * as send from "@/app/api/projects/[projectId]/digest/send/route";
import * as settings from "@/app/api/projects/[projectId]/digest/settings/route";
import * as acceptance from "@/app/api/projects/[projectId]/lab/acceptance/route";
import * as sets from "@/app/api/projects/[projectId]/lab/sets/route";
import * as complete from "@/app/api/projects/[projectId]/photos/[photoId]/complete/route";
import * as photo from "@/app/api/projects/[projectId]/photos/[photoId]/route";
import * as amendmentSign from "@/app/api/projects/[projectId]/placements/[id]/amendments/[amendmentId]/sign-off/route";
import * as amendments from "@/app/api/projects/[projectId]/placements/[id]/amendments/route";
import * as placementSign from "@/app/api/projects/[projectId]/placements/[id]/sign-off/route";
import * as transition from "@/app/api/projects/[projectId]/placements/[id]/transition/route";
import * as record from "@/app/api/projects/[projectId]/records/[type]/[id]/route";
import * as records from "@/app/api/projects/[projectId]/records/[type]/route";
import * as report from "@/app/api/projects/[projectId]/reports/daily/route";
import * as visitSign from "@/app/api/projects/[projectId]/site-visits/[id]/sign-off/route";
import { projectWithTeam } from "../integration/helpers";
import { attack, tableCounts } from "./attack";

type AnyHandler = Parameters<typeof attack>[0];
type Case = { name: string; handler: AnyHandler; method: string; extra: Record<string, string> };

const id = () => randomUUID();
const ROUTES: Case[] = [
  { name: "records list", handler: records.GET as AnyHandler, method: "GET", extra: { type: "placements" } },
  { name: "records create", handler: records.POST as AnyHandler, method: "POST", extra: { type: "placements" } },
  { name: "record read", handler: record.GET as AnyHandler, method: "GET", extra: { type: "placements", id: id() } },
  { name: "record update", handler: record.PATCH as AnyHandler, method: "PATCH", extra: { type: "placements", id: id() } },
  { name: "record delete", handler: record.DELETE as AnyHandler, method: "DELETE", extra: { type: "placements", id: id() } },
  { name: "transition", handler: transition.POST as AnyHandler, method: "POST", extra: { id: id() } },
  { name: "placement sign-off read", handler: placementSign.GET as AnyHandler, method: "GET", extra: { id: id() } },
  { name: "placement sign-off", handler: placementSign.POST as AnyHandler, method: "POST", extra: { id: id() } },
  { name: "amendment", handler: amendments.POST as AnyHandler, method: "POST", extra: { id: id() } },
  { name: "amendment sign-off", handler: amendmentSign.POST as AnyHandler, method: "POST", extra: { id: id(), amendmentId: id() } },
  { name: "visit sign-off read", handler: visitSign.GET as AnyHandler, method: "GET", extra: { id: id() } },
  { name: "visit sign-off", handler: visitSign.POST as AnyHandler, method: "POST", extra: { id: id() } },
  { name: "audit trail", handler: audit.GET as AnyHandler, method: "GET", extra: { recordId: id() } },
  { name: "lab sets", handler: sets.GET as AnyHandler, method: "GET", extra: {} },
  { name: "lab acceptance", handler: acceptance.GET as AnyHandler, method: "GET", extra: {} },
  { name: "digest history", handler: history.GET as AnyHandler, method: "GET", extra: {} },
  { name: "digest settings", handler: settings.PUT as AnyHandler, method: "PUT", extra: {} },
  { name: "digest recipients", handler: recipients.GET as AnyHandler, method: "GET", extra: {} },
  { name: "digest recipient add", handler: recipients.POST as AnyHandler, method: "POST", extra: {} },
  { name: "digest recipient change", handler: recipient.PATCH as AnyHandler, method: "PATCH", extra: { recipientId: id() } },
  { name: "digest recipient remove", handler: recipient.DELETE as AnyHandler, method: "DELETE", extra: { recipientId: id() } },
  { name: "digest preview", handler: preview.GET as AnyHandler, method: "GET", extra: {} },
  { name: "digest send", handler: send.POST as AnyHandler, method: "POST", extra: {} },
  { name: "daily report", handler: report.GET as AnyHandler, method: "GET", extra: {} },
  { name: "photo link", handler: photo.GET as AnyHandler, method: "GET", extra: { photoId: id() } },
  { name: "photo upload", handler: photo.POST as AnyHandler, method: "POST", extra: { photoId: id() } },
  { name: "photo complete", handler: complete.POST as AnyHandler, method: "POST", extra: { photoId: id() } },
];

// A body that would pass most schemas' shape checks, so a refusal is not just a validation error.
const BODY = JSON.stringify({ baseVersion: 1, patch: {}, to: "ready", digestHour: 6, email: "x@example.test", date: "2026-11-17" });

describe("path ids: one policy on every project route", () => {
  let s: Awaited<ReturnType<typeof projectWithTeam>>;
  beforeAll(async () => {
    s = await projectWithTeam();
  });

  it.each(ROUTES.map((r) => [r.name, r]))("%s: foreign and missing projects get the same 404, malformed ids a 400 naming the parameter; nothing written", async (_name, route) => {
    const before = await tableCounts();
    const call = (params: Record<string, string>) =>
      attack(route.handler, {
        user: s.outsider,
        method: route.method,
        url: "/api/projects/x?date=2026-11-17",
        params,
        body: route.method === "GET" || route.method === "DELETE" ? null : BODY,
      });
    const foreign = await call({ projectId: s.project.id, ...route.extra });
    const missing = await call({ projectId: randomUUID(), ...route.extra });
    expect(foreign.status).toBe(404);
    expect(foreign.json).toEqual(missing.json);
    expect(missing.status).toBe(404);

    const badProject = await call({ projectId: "1 or 1=1", ...route.extra });
    expect(badProject.status).toBe(400);
    expect(Object.keys(badProject.json.error.fields)).toEqual(["projectId"]);

    for (const name of Object.keys(route.extra).filter((k) => k !== "type")) {
      // A member asks, so the project check passes and only the malformed id can refuse.
      const bad = await attack(route.handler, {
        user: s.team.office,
        method: route.method,
        params: { projectId: s.project.id, ...route.extra, [name]: "../../etc" },
        body: route.method === "GET" || route.method === "DELETE" ? null : BODY,
      });
      expect(bad.status, `${route.name}: ${name}`).toBe(400);
      expect(bad.json.error.message).toContain(name);
    }
    expect(await tableCounts()).toEqual(before);
  });
});
