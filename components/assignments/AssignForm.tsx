"use client";
import { ActionForm } from "@/components/forms/ActionForm";
import { Field, SelectField } from "@/components/forms/Field";
import type { ActionResult } from "@/app/_lib/action";

export interface AssignableVersion {
  drillId: string;
  version: number;
  label: string;
}

type Action = (previous: ActionResult, form: FormData) => Promise<ActionResult>;

const LATE = [
  { value: "accept-marked", label: "Accept, marked late" },
  { value: "accept-penalty", label: "Accept with a score penalty" },
  { value: "refuse", label: "Refuse late submissions" },
];
const VISIBILITY = [
  { value: "initials", label: "Trainees see initials" },
  { value: "names", label: "Trainees see full names" },
  { value: "own-rank", label: "Trainees see only their own rank" },
];

/** Assign a published drill version to the cohort; dates are in the cohort's time zone. */
export function AssignForm({ cohortId, timeZone, versions, action, defaults }: { cohortId: string; timeZone: string; versions: AssignableVersion[]; action: Action; defaults: { opensAt: string; dueAt: string } }) {
  if (versions.length === 0) {
    return <p className="text-sm text-ink-soft">No published drill to assign yet. Publish a version of a drill under Drills first.</p>;
  }
  return (
    <ActionForm action={action} submitLabel="Assign to the cohort" className="grid gap-4 md:grid-cols-2">
      <input type="hidden" name="cohortId" value={cohortId} />
      <DrillVersionSelect versions={versions} />
      <Field label="Title shown to trainees" name="title" placeholder="default: the drill's title" maxLength={160} />
      <Field label={`Opens (${timeZone})`} name="opensAt" type="datetime-local" required defaultValue={defaults.opensAt} />
      <Field label={`Due (${timeZone})`} name="dueAt" type="datetime-local" required defaultValue={defaults.dueAt} />
      <Field label="Attempts per trainee" name="attemptLimit" type="number" min={1} max={50} step={1} required defaultValue={3} />
      <SelectField label="Late submissions" name="lateRule" options={LATE} defaultValue="accept-marked" />
      <Field label="Late penalty" name="latePenaltyPercent" type="number" min={0} max={100} step={1} defaultValue={10} unit="%" hint="Used only with “Accept with a score penalty”." />
      <SelectField label="Standings" name="visibility" options={VISIBILITY} defaultValue="initials" />
    </ActionForm>
  );
}

/** The value "<drillId>:<version>" is split by createAssignmentSchema. */
function DrillVersionSelect({ versions }: { versions: AssignableVersion[] }) {
  return (
    <label className="block text-sm md:col-span-2">
      <span className="mb-1 block font-medium text-ink-soft">Drill version</span>
      <select
        name="drillVersion"
        defaultValue={`${versions[0].drillId}:${versions[0].version}`}
        className="w-full rounded-sm border border-rule-strong bg-paper-raised px-3 py-2 text-ink"
      >
        {versions.map((v) => (
          <option key={`${v.drillId}:${v.version}`} value={`${v.drillId}:${v.version}`}>
            {v.label}
          </option>
        ))}
      </select>
      <span className="mt-1 block text-xs text-ink-faint">Only published versions can be assigned; attempts keep the version they ran.</span>
    </label>
  );
}
