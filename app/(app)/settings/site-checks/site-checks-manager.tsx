"use client";

import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { withQueryClient } from "@/components/query-client";
import { Field } from "@/components/ui/field";
import { EmptyState, ErrorState, ListSkeleton } from "@/components/ui/states";
import { apiFetch, ApiError } from "@/lib/client/api";
import { SITE_CHECK_APPLIES_TO, SITE_CHECK_APPLIES_TO_LABELS, type SiteCheckAppliesTo } from "@/lib/site-checks";
import {
  siteCheckItemCreateSchema,
  siteCheckItemEditSchema,
  type SiteCheckItemCreateInput,
  type SiteCheckItemEditInput,
} from "@/lib/schemas/site-check";

interface SiteCheckItem {
  id: number;
  key: string;
  label: string;
  help: string;
  appliesTo: SiteCheckAppliesTo;
  active: boolean;
  sortOrder: number;
  isDefault: boolean;
  commonPractice: boolean;
}

type ItemsResponse = { items: SiteCheckItem[] };

const QUERY_KEY = ["site-checks", "all"] as const;

function SiteChecksManagerView() {
  const queryClient = useQueryClient();
  const items = useQuery({ queryKey: QUERY_KEY, queryFn: () => apiFetch<ItemsResponse>("/api/site-checks?includeInactive=1") });
  const [rowError, setRowError] = useState<string | null>(null);
  const [editingId, setEditingId] = useState<number | null>(null);

  const toggle = useMutation({
    mutationFn: (args: { id: number; active: boolean }) => apiFetch<{ item: SiteCheckItem }>(`/api/site-checks/${args.id}`, { method: "PATCH", body: { active: args.active } }),
    onMutate: () => setRowError(null),
    onError: (error) => setRowError(error.message),
    onSettled: () => queryClient.invalidateQueries({ queryKey: QUERY_KEY }),
  });

  const reorder = useMutation({
    mutationFn: (ids: number[]) => apiFetch<ItemsResponse>("/api/site-checks/order", { method: "PUT", body: { ids } }),
    onMutate: async (ids) => {
      setRowError(null);
      await queryClient.cancelQueries({ queryKey: QUERY_KEY });
      const previous = queryClient.getQueryData<ItemsResponse>(QUERY_KEY);
      if (previous) {
        const byId = new Map(previous.items.map((item) => [item.id, item]));
        const next = ids.map((id) => byId.get(id)).filter((item): item is SiteCheckItem => item !== undefined);
        queryClient.setQueryData<ItemsResponse>(QUERY_KEY, { items: next });
      }
      return { previous };
    },
    onError: (error, _ids, context) => {
      if (context?.previous) queryClient.setQueryData(QUERY_KEY, context.previous);
      setRowError(error.message);
    },
    onSuccess: (data) => queryClient.setQueryData(QUERY_KEY, data),
  });

  function move(list: SiteCheckItem[], index: number, by: -1 | 1) {
    const target = index + by;
    if (target < 0 || target >= list.length) return;
    const ids = list.map((item) => item.id);
    const [moved] = ids.splice(index, 1);
    if (moved === undefined) return;
    ids.splice(target, 0, moved);
    reorder.mutate(ids);
  }

  const busy = toggle.isPending || reorder.isPending;

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
      <section aria-labelledby="site-checks-title" className="min-w-0 space-y-3">
        <h2 id="site-checks-title" className="sr-only">
          Your site-check list
        </h2>
        <div aria-live="polite">{rowError ? <ErrorState title="The change was not saved." message={rowError} /> : null}</div>
        {items.isPending ? (
          <ListSkeleton label="Loading site checks" rows={6} />
        ) : items.isError ? (
          <ErrorState title="The site-check list could not be loaded." message={items.error.message} onRetry={() => items.refetch()} />
        ) : items.data.items.length === 0 ? (
          <EmptyState title="No site checks yet">Add the first item with the form beside this list.</EmptyState>
        ) : (
          <ol className="space-y-2">
            {items.data.items.map((item, index, list) => (
              <li key={item.id} className={`card p-3 ${item.active ? "" : "bg-ink-50 opacity-75"}`} data-testid={`site-check-${item.key}`}>
                {editingId === item.id ? (
                  <EditItemForm
                    item={item}
                    onDone={(saved) => {
                      setEditingId(null);
                      if (saved) void queryClient.invalidateQueries({ queryKey: QUERY_KEY });
                    }}
                  />
                ) : (
                  <div className="flex flex-wrap items-start gap-3 sm:flex-nowrap">
                    <span aria-hidden="true" className="mt-0.5 w-6 shrink-0 text-right font-mono text-sm text-ink-400">
                      {index + 1}
                    </span>
                    <div className="min-w-0 flex-1">
                      <p className="font-semibold text-ink-900">{item.label}</p>
                      {item.help ? <p className="mt-0.5 text-sm text-ink-600">{item.help}</p> : null}
                      <p className="mt-1 flex flex-wrap gap-1.5 text-xs">
                        <span className="rounded-full bg-ink-100 px-2 py-0.5 font-medium text-ink-700">{SITE_CHECK_APPLIES_TO_LABELS[item.appliesTo]}</span>
                        {item.commonPractice ? <span className="rounded-full bg-ink-100 px-2 py-0.5 text-ink-600">Common practice</span> : null}
                        {!item.isDefault ? <span className="rounded-full bg-copper-50 px-2 py-0.5 text-copper-700">Added by your company</span> : null}
                        {!item.active ? <span className="rounded-full bg-warn-soft px-2 py-0.5 font-medium text-warn">Inactive: not shown to installers</span> : null}
                      </p>
                    </div>
                    <div className="flex w-full shrink-0 flex-wrap items-center justify-end gap-1 sm:w-auto">
                      <button
                        type="button"
                        className="btn-ghost px-3 text-lg"
                        aria-label={`Move “${item.label}” up`}
                        title="Move up"
                        disabled={busy || index === 0}
                        onClick={() => move(list, index, -1)}
                      >
                        <span aria-hidden="true">↑</span>
                      </button>
                      <button
                        type="button"
                        className="btn-ghost px-3 text-lg"
                        aria-label={`Move “${item.label}” down`}
                        title="Move down"
                        disabled={busy || index === list.length - 1}
                        onClick={() => move(list, index, 1)}
                      >
                        <span aria-hidden="true">↓</span>
                      </button>
                      <button type="button" className="btn-secondary" disabled={busy} onClick={() => setEditingId(item.id)} aria-label={`Edit “${item.label}”`}>
                        Edit
                      </button>
                      {item.active ? (
                        <button type="button" className="btn-danger" disabled={busy} onClick={() => toggle.mutate({ id: item.id, active: false })} aria-label={`Deactivate “${item.label}”`}>
                          Deactivate
                        </button>
                      ) : (
                        <button type="button" className="btn-secondary" disabled={busy} onClick={() => toggle.mutate({ id: item.id, active: true })} aria-label={`Reactivate “${item.label}”`}>
                          Reactivate
                        </button>
                      )}
                    </div>
                  </div>
                )}
              </li>
            ))}
          </ol>
        )}
      </section>
      <AddItemForm onAdded={() => queryClient.invalidateQueries({ queryKey: QUERY_KEY })} />
    </div>
  );
}

function AppliesToOptions() {
  return SITE_CHECK_APPLIES_TO.map((value) => (
    <option key={value} value={value}>
      {SITE_CHECK_APPLIES_TO_LABELS[value]}
    </option>
  ));
}

function EditItemForm({ item, onDone }: { item: SiteCheckItem; onDone: (saved: boolean) => void }) {
  const [formError, setFormError] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SiteCheckItemEditInput>({ resolver: zodResolver(siteCheckItemEditSchema), defaultValues: { label: item.label, help: item.help, appliesTo: item.appliesTo } });
  const prefix = `edit-${item.id}`;

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await apiFetch(`/api/site-checks/${item.id}`, { method: "PATCH", body: values });
      onDone(true);
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [field, message] of Object.entries(error.fields)) if (field in values) setError(field as keyof SiteCheckItemEditInput, { message });
        setFormError(error.message);
      } else setFormError("The item could not be saved.");
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-label={`Edit “${item.label}”`}>
      <Field id={`${prefix}-label`} label="What the installer confirms" error={errors.label?.message}>
        <input id={`${prefix}-label`} className="input" autoFocus aria-invalid={errors.label ? true : undefined} aria-describedby={`${prefix}-label-error`} {...register("label")} />
      </Field>
      <Field id={`${prefix}-help`} label="Help for the installer" hint="Optional. How to check it, or why it matters." error={errors.help?.message}>
        <textarea id={`${prefix}-help`} rows={3} className="input" aria-invalid={errors.help ? true : undefined} aria-describedby={`${prefix}-help-error`} {...register("help")} />
      </Field>
      <Field id={`${prefix}-applies`} label="Applies to" error={errors.appliesTo?.message}>
        <select id={`${prefix}-applies`} className="input sm:w-auto" {...register("appliesTo")}>
          <AppliesToOptions />
        </select>
      </Field>
      <div aria-live="polite">{formError ? <p className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{formError}</p> : null}</div>
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Save"}
        </button>
        <button type="button" className="btn-ghost" disabled={isSubmitting} onClick={() => onDone(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}

function AddItemForm({ onAdded }: { onAdded: () => void }) {
  const [formError, setFormError] = useState<string | null>(null);
  const [added, setAdded] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<SiteCheckItemCreateInput>({ resolver: zodResolver(siteCheckItemCreateSchema), defaultValues: { label: "", help: "", appliesTo: "all" } });

  const onSubmit = handleSubmit(async (values) => {
    setFormError(null);
    setAdded(null);
    try {
      const result = await apiFetch<{ item: SiteCheckItem }>("/api/site-checks", { method: "POST", body: values });
      setAdded(result.item.label);
      reset();
      onAdded();
    } catch (error) {
      if (error instanceof ApiError) {
        for (const [field, message] of Object.entries(error.fields)) if (field in values) setError(field as keyof SiteCheckItemCreateInput, { message });
        setFormError(error.message);
      } else setFormError("The item could not be added.");
    }
  });

  return (
    <section aria-labelledby="add-site-check-title" className="card h-fit space-y-3 p-4">
      <h2 id="add-site-check-title" className="text-base font-bold">
        Add an item
      </h2>
      <form onSubmit={onSubmit} noValidate className="space-y-3">
        <Field id="site-check-label" label="What the installer confirms" hint="Phrase it so that “yes” means it is right, e.g. “The flue collar screws are tight”." error={errors.label?.message}>
          <input id="site-check-label" className="input" aria-invalid={errors.label ? true : undefined} {...register("label")} />
        </Field>
        <Field id="site-check-help" label="Help for the installer" hint="Optional. How to check it, or why it matters." error={errors.help?.message}>
          <textarea id="site-check-help" rows={3} className="input" aria-invalid={errors.help ? true : undefined} {...register("help")} />
        </Field>
        <Field id="site-check-applies" label="Applies to" error={errors.appliesTo?.message}>
          <select id="site-check-applies" className="input" {...register("appliesTo")}>
            <AppliesToOptions />
          </select>
        </Field>
        <div aria-live="polite">
          {formError ? <p className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{formError}</p> : null}
          {added ? (
            <p role="status" className="rounded-md bg-pass-soft px-3 py-2 text-sm font-medium text-pass">
              Added “{added}” at the end of the list.
            </p>
          ) : null}
        </div>
        <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>
          {isSubmitting ? "Adding…" : "Add item"}
        </button>
      </form>
    </section>
  );
}

export const SiteChecksManager = withQueryClient(SiteChecksManagerView);
