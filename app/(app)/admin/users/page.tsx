import type { Metadata } from "next";
import { guardPage } from "@/app/_lib/guard";
import { cohortsFor, organizationUsers } from "@/db/queries";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field, SelectField } from "@/components/forms/Field";
import { UserStatusButton } from "@/components/forms/UserStatusButton";
import { TableHead } from "@/components/tables/TableHead";
import { inviteUser, setActive } from "../actions";

export const metadata: Metadata = { title: "Users" };

export default async function AdminUsersPage() {
  const admin = await guardPage({ roles: ["admin"] });
  const [people, cohorts] = await Promise.all([organizationUsers(admin.organizationId), cohortsFor(admin)]);
  return (
    <div className="grid gap-10 lg:grid-cols-[1fr_20rem]">
      <section>
        <h1 className="mb-4 text-xl font-semibold">Users</h1>
        <table className="w-full border-collapse text-sm">
          <TableHead columns={["Name", "E-mail", "Role", "Status", ""]} />
          <tbody>
            {people.map((p) => (
              <tr key={p.id} className="border-b border-rule" data-testid="user-row" data-email={p.email}>
                <td className="py-2">{p.displayName}</td>
                <td className="py-2 text-ink-soft">{p.email}</td>
                <td className="py-2">{p.role}</td>
                <td className={`py-2 ${p.status === "active" ? "" : "text-ink-faint"}`}>{p.status}</td>
                <td className="py-2 text-right">
                  {p.id !== admin.id ? <UserStatusButton userId={p.id} active={p.status === "active"} action={setActive} /> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      <aside>
        <h2 className="mb-3 text-sm font-semibold">Invite a user</h2>
        <ActionForm action={inviteUser} submitLabel="Send invitation">
          <Field label="E-mail" name="email" type="email" required />
          <SelectField
            label="Role"
            name="role"
            defaultValue="instructor"
            options={[
              { value: "instructor", label: "Instructor" },
              { value: "trainee", label: "Trainee" },
              { value: "admin", label: "Admin" },
            ]}
          />
          <SelectField label="Cohort (optional)" name="cohortId" options={[{ value: "", label: "— none —" }, ...cohorts.map((c) => ({ value: c.id, label: c.name }))]} />
        </ActionForm>
      </aside>
    </div>
  );
}
