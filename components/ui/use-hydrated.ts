"use client";

import { useSyncExternalStore } from "react";

const never = () => () => undefined;

/**
 * False in the server's HTML and while React hydrates it, true once this page's script runs.
 * A form whose sending is done by script keeps its submit button disabled until then: a press
 * before that moment would make the browser send the form itself (reloading the page, dropping
 * what was typed or chosen, and for a GET form putting the fields in the address) instead of
 * doing what the button says. Fields stay editable, so nothing typed early is lost.
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    never,
    () => true,
    () => false,
  );
}
