"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { withQueryClient } from "@/components/query-client";
import { Field } from "@/components/ui/field";
import { apiFetch, ApiError } from "@/lib/client/api";
import { JOB_STATUSES, JOB_STATUS_LABELS, jobFormSchema, type JobFormInput, type JobFormValues } from "@/lib/schemas/job";

type FieldName = keyof JobFormInput;

export interface AssignableMember {
  id: number;
  name: string;
  role: string;
}

/**
 * Create or edit a job. The same zod schema checks the fields here and in the route handler;
 * server field errors land beside their fields.
 */
function JobFormView({
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
  const queryClient = useQueryClient();
  const [formError, setFormError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const [currentVersion, setCurrentVersion] = useState(version ?? 1);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting, isDirty },
    reset,
  } = useForm<JobFormInput, unknown, JobFormValues>({
    resolver: zodResolver(jobFormSchema),
    defaultValues: {
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
    },
  });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setSaved(false);
    try {
      if (mode === "create") {
        const result = await apiFetch<{ job: { id: number } }>("/api/jobs", { method: "POST", body: values });
        await queryClient.invalidateQueries({ queryKey: ["jobs"] });
        router.push(`/jobs/${result.job.id}`);
        router.refresh();
      } else {
        const result = await apiFetch<{ job: JobFormValues & { version: number } }>(`/api/jobs/${jobId}`, {
          method: "PUT",
          body: { ...values, version: currentVersion },
        });
        setCurrentVersion(result.job.version);
        reset(values);
        setSaved(true);
        await queryClient.invalidateQueries({ queryKey: ["jobs"] });
        router.refresh();
      }
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [field, message] of Object.entries(error.fields)) {
          setError(field as FieldName, { message });
        }
        setFormError(error.message);
      } else {
        setFormError("The job could not be saved. Try again.");
      }
    }
  });

  const text = (name: FieldName, label: string, options: { type?: string; autoComplete?: string; inputMode?: "text" | "tel" | "email"; hint?: string; className?: string } = {}) => (
    <Field id={`job-${name}`} label={label} error={errors[name]?.message} hint={options.hint} className={options.className}>
      <input
        id={`job-${name}`}
        type={options.type ?? "text"}
        inputMode={options.inputMode}
        autoComplete={options.autoComplete ?? "off"}
        className="input"
        aria-invalid={errors[name] ? true : undefined}
        aria-describedby={`job-${name}-error`}
        {...register(name)}
      />
    </Field>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-5" aria-label={mode === "create" ? "New job" : "Edit job"}>
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
        <Field id="job-status" label="Status" error={errors.status?.message}>
          <select id="job-status" className="input" aria-describedby="job-status-error" {...register("status")}>
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
          error={errors.assignedInstallerId?.message}
          hint={canAssign ? undefined : "A supervisor or admin assigns jobs."}
        >
          <select
            id="job-assignedInstallerId"
            className="input"
            disabled={!canAssign}
            aria-describedby="job-assignedInstallerId-error"
            {...register("assignedInstallerId", { setValueAs: (v) => (v === "" || v === null || v === undefined ? null : Number(v)) })}
          >
            <option value="">Unassigned</option>
            {members.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name} ({m.role})
              </option>
            ))}
          </select>
        </Field>
        {text("scheduledFor", "Visit date", { type: "date", hint: "YYYY-MM-DD" })}
        <Field id="job-notes" label="Notes" error={errors.notes?.message} className="sm:col-span-2">
          <textarea id="job-notes" rows={4} className="input" aria-describedby="job-notes-error" {...register("notes")} />
        </Field>
      </fieldset>

      <div aria-live="polite" className="space-y-2">
        {formError ? (
          <p role="alert" className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">
            {formError}
          </p>
        ) : null}
        {saved && !isDirty ? <p className="rounded-md bg-pass-soft px-3 py-2 text-sm font-medium text-pass">Saved.</p> : null}
      </div>

      <div className="flex flex-wrap gap-3">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : mode === "create" ? "Create job" : "Save changes"}
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

export const JobForm = withQueryClient(JobFormView);
