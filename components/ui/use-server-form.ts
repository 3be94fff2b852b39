"use client";

import { useState } from "react";
import { ApiError } from "@/lib/client/api";
import { useHydrated } from "./use-hydrated";

export type FieldErrors<F extends string> = Partial<Record<F, string>>;

/**
 * State for a form the server checks: the handler parses the body with the form's zod schema and
 * answers each bad field with that schema's message, which this hook puts beside the field (and
 * moves the focus to the first). The browser carries no schema and no form library, so a page
 * built on it stays light; the words are still the schema's, written once. Fields stay as the
 * user typed them unless the send succeeds.
 */
export function useServerForm<F extends string>(fieldNames: readonly F[]) {
  const [errors, setErrors] = useState<FieldErrors<F>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [submitting, setSubmitting] = useState(false);
  // Until the script runs, the submit button is disabled (see useHydrated).
  const ready = useHydrated();

  function focusFirst(form: HTMLFormElement, found: FieldErrors<F>) {
    const first = fieldNames.find((f) => found[f]);
    if (first) (form.elements.namedItem(first) as HTMLElement | null)?.focus?.();
  }

  /**
   * Runs `send` with the form's values; resolves true when it succeeded. `checkFirst` may refuse
   * before sending (for a check that needs no server, such as two passwords that differ).
   */
  async function submit(
    form: HTMLFormElement,
    send: (values: Record<F, string>) => Promise<void>,
    options: { failure: string; checkFirst?: (values: Record<F, string>) => FieldErrors<F> },
  ): Promise<boolean> {
    const data = new FormData(form);
    const values = Object.fromEntries(fieldNames.map((f) => [f, String(data.get(f) ?? "")])) as Record<F, string>;
    setFormError(null);
    const early = options.checkFirst?.(values) ?? {};
    setErrors(early);
    if (Object.keys(early).length > 0) {
      focusFirst(form, early);
      return false;
    }
    setSubmitting(true);
    try {
      await send(values);
      return true;
    } catch (error) {
      if (error instanceof ApiError) {
        const fromServer: FieldErrors<F> = {};
        for (const [field, message] of Object.entries(error.fields)) if ((fieldNames as readonly string[]).includes(field)) fromServer[field as F] = message;
        setErrors(fromServer);
        setFormError(error.message);
        focusFirst(form, fromServer);
      } else setFormError(options.failure);
      return false;
    } finally {
      setSubmitting(false);
    }
  }

  /** Props for an input: its name, and the error wiring Field expects (`<id>-error`). */
  function fieldProps(name: F, id: string) {
    return { id, name, "aria-invalid": errors[name] ? true : undefined, "aria-describedby": `${id}-error` } as const;
  }

  return { errors, formError, submitting, ready, submit, fieldProps };
}
