"use client";

import { usePathname, useRouter } from "next/navigation";
import { useEffect, useRef, useState, useTransition } from "react";
import { listSearch, type ListFilters } from "@/lib/lists/list-address";

const TYPING_PAUSE_MS = 250;

/**
 * Filters of a server-rendered list, kept in the page's address. A change to a select or a
 * checkbox replaces the address at once; typed text waits for a short pause. The server renders
 * the new list; `pending` is true until it arrives. Going back or forward puts the filters the
 * address holds back into the controls.
 */
export function useListFilters<F extends ListFilters>(current: F, defaults: F, textKeys: readonly (keyof F)[] = []) {
  const router = useRouter();
  const pathname = usePathname();
  const [values, setValues] = useState<F>(current);
  const [pending, startTransition] = useTransition();
  const lastAddress = useRef(listSearch(current, defaults));
  const typingTimer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);

  const currentAddress = listSearch(current, defaults);
  useEffect(() => {
    // The address changed without us (back, forward, a link): show what it holds.
    if (currentAddress !== lastAddress.current) {
      lastAddress.current = currentAddress;
      setValues(current);
    }
    // `current` is a fresh object on every render; its address is what matters.
  }, [currentAddress]);
  useEffect(() => {
    // Leaving the list (a link, back or forward) drops a search still waiting for the typing pause,
    // so it cannot pull the page back to the list after the next page has been asked for.
    const dropPendingSearch = (event: Event) => {
      if (event.type === "popstate" || (event.target instanceof Element && event.target.closest("a[href]"))) clearTimeout(typingTimer.current);
    };
    document.addEventListener("click", dropPendingSearch, true);
    window.addEventListener("popstate", dropPendingSearch);
    return () => {
      clearTimeout(typingTimer.current);
      document.removeEventListener("click", dropPendingSearch, true);
      window.removeEventListener("popstate", dropPendingSearch);
    };
  }, []);

  const go = (next: F) => {
    const address = listSearch(next, defaults);
    if (address === lastAddress.current) return;
    lastAddress.current = address;
    startTransition(() => router.replace(`${pathname}${address}`, { scroll: false }));
  };

  const set = <K extends keyof F>(key: K, value: F[K]) => {
    const next = { ...values, [key]: value };
    setValues(next);
    clearTimeout(typingTimer.current);
    if (textKeys.includes(key)) typingTimer.current = setTimeout(() => go(next), TYPING_PAUSE_MS);
    else go(next);
  };

  return { values, set, pending };
}
