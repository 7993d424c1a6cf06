"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Select } from "@/components/ui/select";
import { callApi } from "@/lib/api/client";
import { PROJECT_ROLES, ROLE_LABELS, type ProjectRole } from "@/lib/auth/roles";
import { Table } from "@/components/ui/table";

type Member = { userId: string; name: string; email: string; role: ProjectRole };

export function MemberManager({ projectId, members }: { projectId: string; members: Member[] }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<ProjectRole>("superintendent");
  const [fieldError, setFieldError] = useState<string | undefined>();
  const base = `/api/admin/projects/${projectId}/members`;

  async function run(action: Promise<{ ok: true } | { ok: false; error: { message: string; fields?: Record<string, string> } }>, done: string) {
    setMessage(null);
    const result = await action;
    if (!result.ok) {
      setFieldError(result.error.fields?.email);
      return setMessage({ tone: "danger", text: result.error.message });
    }
    setFieldError(undefined);
    setMessage({ tone: "success", text: done });
    router.refresh();
  }

  return (
    <div className="grid gap-4 lg:grid-cols-[1fr_24rem]">
      <section className="card overflow-x-auto">
        <Table columns={["Name", "E-mail", "Role", { label: "Remove", hidden: true }]} testId="members-table">
            {members.length === 0 ? (
              <tr><td colSpan={4} className="px-3 py-3 text-muted">No members yet.</td></tr>
            ) : (
              members.map((m) => (
                <tr key={m.userId}>
                  <td className="px-3 py-2 font-semibold">{m.name}</td>
                  <td className="px-3 py-2">{m.email}</td>
                  <td className="px-3 py-2">
                    <label className="sr-only" htmlFor={`role-${m.userId}`}>Role of {m.name}</label>
                    <select
                      id={`role-${m.userId}`}
                      defaultValue={m.role}
                      className="min-h-11 rounded-md border border-ink-300 bg-white px-2"
                      onChange={(e) => run(callApi(`${base}/${m.userId}`, { method: "PATCH", body: { role: e.target.value } }), `${m.name} is now ${ROLE_LABELS[e.target.value as ProjectRole]}.`)}
                    >
                      {PROJECT_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
                    </select>
                  </td>
                  <td className="px-3 py-2 text-right">
                    <Button variant="secondary" onClick={() => run(callApi(`${base}/${m.userId}`, { method: "DELETE" }), `${m.name} was removed from the project.`)}>
                      Remove
                    </Button>
                  </td>
                </tr>
              ))
            )}
          </Table>
      </section>
      <section className="card flex flex-col gap-3 p-4" aria-labelledby="add-member">
        <h2 id="add-member" className="text-lg font-bold">Add a member</h2>
        {message ? <Notice tone={message.tone} title={message.text} testId="member-result" /> : null}
        <form
          className="flex flex-col gap-3"
          noValidate
          onSubmit={(e) => {
            e.preventDefault();
            run(callApi(base, { body: { email, role } }), `${email} added as ${ROLE_LABELS[role]}.`).then(() => setEmail(""));
          }}
        >
          <Field label="E-mail of an existing account" type="email" value={email} onChange={(e) => setEmail(e.target.value)} error={fieldError} />
          <Select label="Role" value={role} onChange={(e) => setRole(e.target.value as ProjectRole)}>
            {PROJECT_ROLES.map((r) => <option key={r} value={r}>{ROLE_LABELS[r]}</option>)}
          </Select>
          <Button type="submit">Add to project</Button>
        </form>
      </section>
    </div>
  );
}
