"use client";

import { useState, type FormEvent } from "react";
import { Field } from "@/components/ui/field";
import { EmptyState, ErrorState } from "@/components/ui/states";
import { useServerForm } from "@/components/ui/use-server-form";
import { apiFetch } from "@/lib/client/api";
import { SITE_CHECK_APPLIES_TO, SITE_CHECK_APPLIES_TO_LABELS, type SiteCheckAppliesTo } from "@/lib/site-checks";

/** Fields of the add and edit forms; `siteCheckItemCreateSchema` / `siteCheckItemEditSchema` check them on the server. */
const ITEM_FIELDS = ["label", "help", "appliesTo"] as const;

export interface SiteCheckItem {
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

/**
 * The company's site-check list, first drawn from what the page read on the server. Each change
 * goes to the API and the list is then read again, so it always shows what is stored; a reorder
 * shows at once and is undone if the server refuses it.
 */
export function SiteChecksManager({ initialItems }: { initialItems: SiteCheckItem[] }) {
  const [items, setItems] = useState(initialItems);
  const [rowError, setRowError] = useState<string | null>(null);
  const [editingId, setEditingId] = useState<number | null>(null);
  const [busy, setBusy] = useState(false);

  async function reload() {
    try {
      setItems((await apiFetch<ItemsResponse>("/api/site-checks?includeInactive=1")).items);
    } catch (error) {
      setRowError(`The list could not be read again: ${(error as Error).message}`);
    }
  }

  async function change(run: () => Promise<unknown>, undo?: () => void) {
    setRowError(null);
    setBusy(true);
    try {
      await run();
    } catch (error) {
      undo?.();
      setRowError((error as Error).message);
    } finally {
      await reload();
      setBusy(false);
    }
  }

  const toggle = (id: number, active: boolean) => change(() => apiFetch(`/api/site-checks/${id}`, { method: "PATCH", body: { active } }));

  function reorder(ids: number[]) {
    const previous = items;
    const byId = new Map(items.map((item) => [item.id, item]));
    setItems(ids.map((id) => byId.get(id)).filter((item): item is SiteCheckItem => item !== undefined));
    void change(
      () => apiFetch<ItemsResponse>("/api/site-checks/order", { method: "PUT", body: { ids } }),
      () => setItems(previous),
    );
  }

  function move(list: SiteCheckItem[], index: number, by: -1 | 1) {
    const target = index + by;
    if (target < 0 || target >= list.length) return;
    const ids = list.map((item) => item.id);
    const [moved] = ids.splice(index, 1);
    if (moved === undefined) return;
    ids.splice(target, 0, moved);
    reorder(ids);
  }

  return (
    <div className="grid gap-6 lg:grid-cols-[1fr_22rem]">
      <section aria-labelledby="site-checks-title" className="min-w-0 space-y-3">
        <h2 id="site-checks-title" className="sr-only">
          Your site-check list
        </h2>
        <div aria-live="polite">{rowError ? <ErrorState title="The change was not saved." message={rowError} /> : null}</div>
        {items.length === 0 ? (
          <EmptyState title="No site checks yet">Add the first item with the form beside this list.</EmptyState>
        ) : (
          <ol className="space-y-2">
            {items.map((item, index, list) => (
              <li key={item.id} className={`card p-3 ${item.active ? "" : "bg-ink-50 opacity-75"}`} data-testid={`site-check-${item.key}`}>
                {editingId === item.id ? (
                  <EditItemForm
                    item={item}
                    onDone={(saved) => {
                      setEditingId(null);
                      if (saved) void reload();
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
                        <button type="button" className="btn-danger" disabled={busy} onClick={() => void toggle(item.id, false)} aria-label={`Deactivate “${item.label}”`}>
                          Deactivate
                        </button>
                      ) : (
                        <button type="button" className="btn-secondary" disabled={busy} onClick={() => void toggle(item.id, true)} aria-label={`Reactivate “${item.label}”`}>
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
      <AddItemForm onAdded={() => void reload()} />
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
  const form = useServerForm(ITEM_FIELDS);
  const prefix = `edit-${item.id}`;

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const ok = await form.submit(event.currentTarget, (values) => apiFetch(`/api/site-checks/${item.id}`, { method: "PATCH", body: values }), { failure: "The item could not be saved." });
    if (ok) onDone(true);
  }

  return (
    <form method="post" onSubmit={onSubmit} noValidate className="space-y-3" aria-label={`Edit “${item.label}”`}>
      <Field id={`${prefix}-label`} label="What the installer confirms" error={form.errors.label}>
        <input className="input" autoFocus defaultValue={item.label} {...form.fieldProps("label", `${prefix}-label`)} />
      </Field>
      <Field id={`${prefix}-help`} label="Help for the installer" hint="Optional. How to check it, or why it matters." error={form.errors.help}>
        <textarea rows={3} className="input" defaultValue={item.help} {...form.fieldProps("help", `${prefix}-help`)} />
      </Field>
      <Field id={`${prefix}-applies`} label="Applies to" error={form.errors.appliesTo}>
        <select className="input sm:w-auto" defaultValue={item.appliesTo} {...form.fieldProps("appliesTo", `${prefix}-applies`)}>
          <AppliesToOptions />
        </select>
      </Field>
      <div aria-live="polite">{form.formError ? <p className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{form.formError}</p> : null}</div>
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={!form.ready || form.submitting}>
          {form.submitting ? "Saving…" : "Save"}
        </button>
        <button type="button" className="btn-ghost" disabled={form.submitting} onClick={() => onDone(false)}>
          Cancel
        </button>
      </div>
    </form>
  );
}

function AddItemForm({ onAdded }: { onAdded: () => void }) {
  const form = useServerForm(ITEM_FIELDS);
  const [added, setAdded] = useState<string | null>(null);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const element = event.currentTarget;
    setAdded(null);
    await form.submit(
      element,
      async (values) => {
        const result = await apiFetch<{ item: SiteCheckItem }>("/api/site-checks", { method: "POST", body: values });
        setAdded(result.item.label);
        element.reset();
        onAdded();
      },
      { failure: "The item could not be added." },
    );
  }

  return (
    <section aria-labelledby="add-site-check-title" className="card h-fit space-y-3 p-4">
      <h2 id="add-site-check-title" className="text-base font-bold">
        Add an item
      </h2>
      <form method="post" onSubmit={onSubmit} noValidate className="space-y-3">
        <Field id="site-check-label" label="What the installer confirms" hint="Phrase it so that “yes” means it is right, e.g. “The flue collar screws are tight”." error={form.errors.label}>
          <input className="input" {...form.fieldProps("label", "site-check-label")} />
        </Field>
        <Field id="site-check-help" label="Help for the installer" hint="Optional. How to check it, or why it matters." error={form.errors.help}>
          <textarea rows={3} className="input" {...form.fieldProps("help", "site-check-help")} />
        </Field>
        <Field id="site-check-applies" label="Applies to" error={form.errors.appliesTo}>
          <select className="input" defaultValue="all" {...form.fieldProps("appliesTo", "site-check-applies")}>
            <AppliesToOptions />
          </select>
        </Field>
        <div aria-live="polite">
          {form.formError ? <p className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{form.formError}</p> : null}
          {added ? (
            <p role="status" className="rounded-md bg-pass-soft px-3 py-2 text-sm font-medium text-pass">
              Added “{added}” at the end of the list.
            </p>
          ) : null}
        </div>
        <button type="submit" className="btn-primary w-full" disabled={!form.ready || form.submitting}>
          {form.submitting ? "Adding…" : "Add item"}
        </button>
      </form>
    </section>
  );
}
