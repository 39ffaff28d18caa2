"use client";

// The roster: the instructor adds a member by e-mail, changes a role or section, removes a member;
// teaching assistants see the same table without the controls.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Field, FormMessage } from "@/components/ui/field";
import type { Role } from "@/db/types";
import { roleLabel } from "@/lib/auth/roles";
import { addMemberSchema, type AddMemberInput } from "@/lib/validation/members";
import { sendJson } from "./send-json";

export interface RosterMember {
  userId: string;
  name: string;
  email: string;
  role: Role;
  section: string | null;
}

type Note = { text: string; tone: "error" | "info" } | null;

function RoleSelect({ value, onChange, label }: { value: Role; onChange: (r: Role) => void; label: string }) {
  return (
    <select aria-label={label} className="field-input mt-0 w-auto py-1" value={value} onChange={(e) => onChange(e.target.value as Role)}>
      {(["student", "ta", "instructor"] as const).map((r) => (
        <option key={r} value={r}>{roleLabel[r]}</option>
      ))}
    </select>
  );
}

function MemberRow({ courseId, m, onNote }: { courseId: string; m: RosterMember; onNote: (n: Note) => void }) {
  const router = useRouter();
  const [role, setRole] = useState<Role>(m.role);
  const [section, setSection] = useState(m.section ?? "");
  const [busy, setBusy] = useState(false);
  const changed = role !== m.role || section !== (m.section ?? "");
  const url = `/api/courses/${courseId}/members/${m.userId}`;

  async function save() {
    setBusy(true);
    const r = await sendJson("PATCH", url, { role, section });
    setBusy(false);
    if (!r.ok) {
      onNote({ text: r.message, tone: "error" });
      setRole(m.role);
      return;
    }
    onNote({ text: `${m.name} is saved as ${roleLabel[role].toLowerCase()}${section ? `, section ${section}` : ""}.`, tone: "info" });
    router.refresh();
  }

  async function remove() {
    if (!window.confirm(`Remove ${m.name} from the course? Their attempts are kept and come back if they are added again.`)) return;
    setBusy(true);
    const r = await sendJson("DELETE", url);
    setBusy(false);
    if (!r.ok) return onNote({ text: r.message, tone: "error" });
    onNote({ text: `${m.name} was removed from the course.`, tone: "info" });
    router.refresh();
  }

  return (
    <tr className="border-t border-ink/10">
      <td className="px-4 py-2">{m.name}</td>
      <td className="px-4 py-2 font-mono text-xs">{m.email}</td>
      <td className="px-4 py-2">
        <RoleSelect value={role} onChange={setRole} label={`Role of ${m.name}`} />
      </td>
      <td className="px-4 py-2">
        <input className="field-input mt-0 w-24 py-1" aria-label={`Section of ${m.name}`} value={section} maxLength={40} onChange={(e) => setSection(e.target.value)} />
      </td>
      <td className="px-4 py-2 whitespace-nowrap">
        <button type="button" className="btn-quiet px-2 py-1" disabled={!changed || busy} onClick={save} aria-label={`Save ${m.name}`}>Save</button>{" "}
        <button type="button" className="btn-quiet px-2 py-1" disabled={busy} onClick={remove} aria-label={`Remove ${m.name}`}>Remove</button>
      </td>
    </tr>
  );
}

function AddMemberForm({ courseId, onNote }: { courseId: string; onNote: (n: Note) => void }) {
  const router = useRouter();
  const form = useForm<AddMemberInput>({ resolver: zodResolver(addMemberSchema), defaultValues: { email: "", role: "student", section: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    const r = await sendJson<{ member: RosterMember }>("POST", `/api/courses/${courseId}/members`, values);
    if (!r.ok) {
      for (const [k, v] of Object.entries(r.fields ?? {})) if (k === "email" || k === "role" || k === "section") form.setError(k, { message: v[0] });
      return onNote({ text: r.message, tone: "error" });
    }
    onNote({ text: `${r.data.member.name} is in the course as ${roleLabel[r.data.member.role].toLowerCase()}.`, tone: "info" });
    form.reset({ email: "", role: values.role, section: "" });
    router.refresh();
  });
  return (
    <form onSubmit={onSubmit} aria-label="Add a member" noValidate className="card mt-6">
      <h2 className="text-lg">Add a member</h2>
      <p className="mt-1 mb-3 text-sm text-ink-soft">The person needs an account. To invite students who have none, import a CSV below.</p>
      <div className="grid gap-x-4 sm:grid-cols-3">
        <Field label="E-mail" type="email" autoComplete="off" {...form.register("email")} error={form.formState.errors.email?.message} />
        <div className="mb-4">
          <label className="field-label" htmlFor="add-role">Role</label>
          <select id="add-role" className="field-input" {...form.register("role")}>
            {(["student", "ta", "instructor"] as const).map((r) => (
              <option key={r} value={r}>{roleLabel[r]}</option>
            ))}
          </select>
        </div>
        <Field label="Section (optional)" {...form.register("section")} error={form.formState.errors.section?.message} />
      </div>
      <button className="btn-primary" type="submit" disabled={form.formState.isSubmitting}>Add to course</button>
    </form>
  );
}

function ReadOnlyRow({ m }: { m: RosterMember }) {
  return (
    <tr className="border-t border-ink/10">
      <td className="px-4 py-2">{m.name}</td>
      <td className="px-4 py-2 font-mono text-xs">{m.email}</td>
      <td className="px-4 py-2">{roleLabel[m.role]}</td>
      <td className="px-4 py-2">{m.section ?? "—"}</td>
    </tr>
  );
}

export function RosterEditor({ courseId, members, canEdit }: { courseId: string; members: RosterMember[]; canEdit: boolean }) {
  const [note, setNote] = useState<Note>(null);
  return (
    <>
      <FormMessage message={note?.text} tone={note?.tone} />
      <div className="card overflow-x-auto p-0">
        <table className="min-w-full text-sm">
          <caption className="sr-only">Course members</caption>
          <thead className="bg-paper-sunk text-left">
            <tr>
              <th scope="col" className="px-4 py-2">Name</th>
              <th scope="col" className="px-4 py-2">E-mail</th>
              <th scope="col" className="px-4 py-2">Role</th>
              <th scope="col" className="px-4 py-2">Section</th>
              {canEdit ? <th scope="col" className="px-4 py-2"><span className="sr-only">Changes</span></th> : null}
            </tr>
          </thead>
          <tbody>
            {members.map((m) =>
              canEdit ? <MemberRow key={`${m.userId}:${m.role}:${m.section ?? ""}`} courseId={courseId} m={m} onNote={setNote} /> : <ReadOnlyRow key={m.userId} m={m} />,
            )}
          </tbody>
        </table>
      </div>
      {canEdit ? <AddMemberForm courseId={courseId} onNote={setNote} /> : null}
    </>
  );
}
