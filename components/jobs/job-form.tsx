"use client";

import { useRouter } from "next/navigation";
import { useState, type FormEvent } from "react";
import { Field } from "@/components/ui/field";
import { useServerForm } from "@/components/ui/use-server-form";
import { apiFetch } from "@/lib/client/api";
// Types only from the schema module: erased in the build, so zod stays out of the browser.
import type { JobFormValues } from "@/lib/schemas/job";
import { JOB_STATUSES, JOB_STATUS_LABELS } from "@/lib/schemas/job-values";

const FIELDS = [
  "customerName",
  "customerPhone",
  "customerEmail",
  "siteStreet",
  "siteCity",
  "siteRegion",
  "sitePostalCode",
  "status",
  "assignedInstallerId",
  "scheduledFor",
  "notes",
] as const;
type FieldName = (typeof FIELDS)[number];
const TEXT_FIELDS = FIELDS.filter((f) => f !== "status" && f !== "assignedInstallerId");

export interface AssignableMember {
  id: number;
  name: string;
  role: string;
}

/**
 * Create or edit a job. `jobFormSchema` checks it in the route handler, and its messages come back
 * beside their fields (useServerForm): the page carries no schema or form library. After a save
 * the fields show the job as stored (trimmed, the e-mail in lower case).
 */
export function JobForm({
  mode,
  jobId,
  version,
  initialValues,
  members,
  canAssign,
  currentUserId,
}: {
  mode: "create" | "edit";
  jobId?: number;
  version?: number;
  initialValues?: Partial<JobFormValues>;
  members: AssignableMember[];
  canAssign: boolean;
  currentUserId: number;
}) {
  const router = useRouter();
  const form = useServerForm(FIELDS);
  const [saved, setSaved] = useState(false);
  const [currentVersion, setCurrentVersion] = useState(version ?? 1);
  const start: JobFormValues = {
    customerName: "",
    customerPhone: "",
    customerEmail: "",
    siteStreet: "",
    siteCity: "",
    siteRegion: "",
    sitePostalCode: "",
    status: "scheduled",
    assignedInstallerId: mode === "create" && !canAssign ? currentUserId : null,
    scheduledFor: "",
    notes: "",
    ...initialValues,
  };

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const element = event.currentTarget;
    setSaved(false);
    await form.submit(
      element,
      async (values) => {
        const body = {
          ...values,
          // A disabled select is not in the form data: who may not assign keeps the job's installer.
          assignedInstallerId: canAssign ? (values.assignedInstallerId === "" ? null : Number(values.assignedInstallerId)) : start.assignedInstallerId,
        };
        if (mode === "create") {
          const result = await apiFetch<{ job: { id: number } }>("/api/jobs", { method: "POST", body });
          router.push(`/jobs/${result.job.id}`);
          router.refresh();
          return;
        }
        const result = await apiFetch<{ job: JobFormValues & { version: number } }>(`/api/jobs/${jobId}`, { method: "PUT", body: { ...body, version: currentVersion } });
        setCurrentVersion(result.job.version);
        for (const name of TEXT_FIELDS) {
          const input = element.elements.namedItem(name) as HTMLInputElement | HTMLTextAreaElement | null;
          if (input) input.value = result.job[name] ?? "";
        }
        setSaved(true);
        router.refresh();
      },
      { failure: "The job could not be saved. Try again." },
    );
  }

  const text = (name: FieldName, label: string, options: { type?: string; autoComplete?: string; inputMode?: "text" | "tel" | "email"; hint?: string; className?: string } = {}) => (
    <Field id={`job-${name}`} label={label} error={form.errors[name]} hint={options.hint} className={options.className}>
      <input
        type={options.type ?? "text"}
        inputMode={options.inputMode}
        autoComplete={options.autoComplete ?? "off"}
        className="input"
        defaultValue={String(start[name] ?? "")}
        {...form.fieldProps(name, `job-${name}`)}
      />
    </Field>
  );

  return (
    // Any edit after a save hides "Saved." until the next one.
    <form method="post" onSubmit={onSubmit} onInput={() => setSaved(false)} noValidate className="space-y-5" aria-label={mode === "create" ? "New job" : "Edit job"}>
      <fieldset className="card grid gap-4 p-4 sm:grid-cols-2">
        <legend className="px-1 text-sm font-bold uppercase tracking-wide text-ink-500">Customer</legend>
        {text("customerName", "Customer name", { autoComplete: "name", className: "sm:col-span-2" })}
        {text("customerPhone", "Phone", { type: "tel", inputMode: "tel", autoComplete: "tel" })}
        {text("customerEmail", "E-mail", { type: "email", inputMode: "email", autoComplete: "email", hint: "Where the signed record is sent." })}
      </fieldset>

      <fieldset className="card grid gap-4 p-4 sm:grid-cols-2">
        <legend className="px-1 text-sm font-bold uppercase tracking-wide text-ink-500">Site</legend>
        {text("siteStreet", "Street address", { autoComplete: "street-address", className: "sm:col-span-2" })}
        {text("siteCity", "Town or city", { autoComplete: "address-level2" })}
        {text("siteRegion", "Region", { autoComplete: "address-level1" })}
        {text("sitePostalCode", "Postal code", { autoComplete: "postal-code" })}
      </fieldset>

      <fieldset className="card grid gap-4 p-4 sm:grid-cols-2">
        <legend className="px-1 text-sm font-bold uppercase tracking-wide text-ink-500">Work</legend>
        <Field id="job-status" label="Status" error={form.errors.status}>
          <select className="input" defaultValue={start.status} {...form.fieldProps("status", "job-status")}>
            {JOB_STATUSES.map((s) => (
              <option key={s} value={s}>
                {JOB_STATUS_LABELS[s]}
              </option>
            ))}
          </select>
        </Field>
        <Field
          id="job-assignedInstallerId"
          label="Assigned installer"
          error={form.errors.assignedInstallerId}
          hint={canAssign ? undefined : "A supervisor or admin assigns jobs."}
        >
          <select className="input" disabled={!canAssign} defaultValue={start.assignedInstallerId ?? ""} {...form.fieldProps("assignedInstallerId", "job-assignedInstallerId")}>
            <option value="">Unassigned</option>
            {members.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name} ({m.role})
              </option>
            ))}
          </select>
        </Field>
        {text("scheduledFor", "Visit date", { type: "date", hint: "YYYY-MM-DD" })}
        <Field id="job-notes" label="Notes" error={form.errors.notes} className="sm:col-span-2">
          <textarea rows={4} className="input" defaultValue={start.notes} {...form.fieldProps("notes", "job-notes")} />
        </Field>
      </fieldset>

      <div aria-live="polite" className="space-y-2">
        {form.formError ? (
          <p role="alert" className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">
            {form.formError}
          </p>
        ) : null}
        {saved ? <p className="rounded-md bg-pass-soft px-3 py-2 text-sm font-medium text-pass">Saved.</p> : null}
      </div>

      <div className="flex flex-wrap gap-3">
        <button type="submit" className="btn-primary" disabled={!form.ready || form.submitting}>
          {form.submitting ? "Saving…" : mode === "create" ? "Create job" : "Save changes"}
        </button>
        {mode === "create" ? (
          <button type="button" className="btn-secondary" onClick={() => router.back()}>
            Cancel
          </button>
        ) : null}
      </div>
    </form>
  );
}
