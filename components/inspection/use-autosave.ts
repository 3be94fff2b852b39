"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { ApiError, apiFetch } from "@/lib/client/api";
import type { InspectionData } from "@/lib/inspections/data";
import type { InspectionFinding } from "@/lib/inspections/evaluate";

export type SaveStatus =
  | { kind: "saved"; at: string }
  | { kind: "pending" }
  | { kind: "saving" }
  | { kind: "failed"; message: string; retryInMs: number }
  | { kind: "conflict"; message: string };

interface LocalDraft {
  version: number;
  data: InspectionData;
  savedAt: string;
}

const DEBOUNCE_MS = 1200;
const RETRY_MS = [3000, 6000, 15000, 30000];

export function localDraftKey(inspectionId: number): string {
  return `flueward:inspection-draft:${inspectionId}`;
}

/** The copy kept on this device, when it is newer than the server's (typed offline, or the save failed). */
export function readLocalDraft(inspectionId: number, serverVersion: number): LocalDraft | null {
  try {
    const raw = window.localStorage.getItem(localDraftKey(inspectionId));
    if (!raw) return null;
    const draft = JSON.parse(raw) as LocalDraft & { unsaved?: boolean };
    return draft.unsaved && draft.version >= serverVersion ? draft : null;
  } catch {
    return null;
  }
}

/**
 * Saves the draft: a copy on the device at every change, the server after a pause in typing,
 * again when the page is hidden or left, and with growing delays after a failure. A 409 stops
 * saving and reports the conflict; nothing typed is dropped.
 */
export function useAutosave({
  inspectionId,
  initialVersion,
  enabled,
  onSaved,
}: {
  inspectionId: number;
  initialVersion: number;
  enabled: boolean;
  onSaved?: (result: { version: number; findings: InspectionFinding[] }) => void;
}) {
  const version = useRef(initialVersion);
  const latest = useRef<InspectionData | null>(null);
  const dirty = useRef(false);
  const inFlight = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const attempt = useRef(0);
  const conflicted = useRef(false);
  const retrying = useRef(false);
  const [status, setStatus] = useState<SaveStatus>({ kind: "saved", at: "" });
  const onSavedRef = useRef(onSaved);
  onSavedRef.current = onSaved;

  const keepLocal = useCallback(
    (data: InspectionData, unsaved: boolean) => {
      try {
        window.localStorage.setItem(localDraftKey(inspectionId), JSON.stringify({ version: version.current, data, savedAt: new Date().toISOString(), unsaved }));
      } catch {
        // storage full or disabled: the server copy still carries the draft
      }
    },
    [inspectionId],
  );

  const inFlightPromise = useRef<Promise<void> | null>(null);
  const flush = useCallback(async (): Promise<void> => {
    if (inFlight.current && inFlightPromise.current) {
      // Wait for the save under way, then send whatever changed meanwhile.
      await inFlightPromise.current;
      return flushRef.current();
    }
    if (!enabled || conflicted.current || !dirty.current || !latest.current) return;
    let release: () => void = () => {};
    inFlightPromise.current = new Promise<void>((resolve) => {
      release = resolve;
    });
    if (timer.current) clearTimeout(timer.current);
    inFlight.current = true;
    dirty.current = false;
    const data = latest.current;
    setStatus({ kind: "saving" });
    try {
      const result = await apiFetch<{ version: number; updatedAt: string; findings: InspectionFinding[] }>(`/api/inspections/${inspectionId}/draft`, {
        method: "PUT",
        body: { version: version.current, data },
      });
      version.current = result.version;
      attempt.current = 0;
      if (!dirty.current) keepLocal(data, false);
      setStatus({ kind: "saved", at: result.updatedAt });
      onSavedRef.current?.({ version: result.version, findings: result.findings });
    } catch (error) {
      dirty.current = true;
      if (error instanceof ApiError && (error.status === 409 || error.status === 422)) {
        conflicted.current = true;
        setStatus({ kind: "conflict", message: error.message });
      } else {
        const wait = RETRY_MS[Math.min(attempt.current, RETRY_MS.length - 1)]!;
        attempt.current += 1;
        setStatus({ kind: "failed", message: error instanceof Error ? error.message : "The draft could not be saved.", retryInMs: wait });
        retrying.current = true;
        timer.current = setTimeout(() => {
          retrying.current = false;
          void flushRef.current();
        }, wait);
      }
    } finally {
      inFlight.current = false;
      release();
      // A change typed while this save was under way is saved next.
      if (dirty.current && !conflicted.current && !retrying.current) {
        timer.current = setTimeout(() => void flushRef.current(), DEBOUNCE_MS);
      }
    }
  }, [enabled, inspectionId, keepLocal]);
  const flushRef = useRef(flush);
  flushRef.current = flush;

  const schedule = useCallback(
    (data: InspectionData) => {
      if (!enabled) return;
      latest.current = data;
      dirty.current = true;
      keepLocal(data, true);
      setStatus((s) => (s.kind === "conflict" ? s : { kind: "pending" }));
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => void flush(), DEBOUNCE_MS);
    },
    [enabled, flush, keepLocal],
  );

  /** After a conflict: take the server's version number and save ours over it. */
  const overwrite = useCallback(async () => {
    const fresh = await apiFetch<{ inspection: { version: number } }>(`/api/inspections/${inspectionId}`);
    version.current = fresh.inspection.version;
    conflicted.current = false;
    dirty.current = true;
    attempt.current = 0;
    await flush();
  }, [flush, inspectionId]);

  const discardLocal = useCallback(() => {
    try {
      window.localStorage.removeItem(localDraftKey(inspectionId));
    } catch {
      // nothing to remove
    }
  }, [inspectionId]);

  useEffect(() => {
    if (!enabled) return;
    // Leaving the page: send what is pending with keepalive so the request survives the unload.
    const onHide = () => {
      if (!dirty.current || !latest.current) return;
      void fetch(`/api/inspections/${inspectionId}/draft`, {
        method: "PUT",
        keepalive: true,
        credentials: "same-origin",
        headers: { "Content-Type": "application/json" },
        body: JSON.stringify({ version: version.current, data: latest.current }),
      });
    };
    // Hidden (app switch, screen off): the page lives on, so save normally and keep the version in step.
    const onVisibility = () => {
      if (document.visibilityState === "hidden") void flushRef.current();
    };
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      if (dirty.current) event.preventDefault();
    };
    window.addEventListener("pagehide", onHide);
    document.addEventListener("visibilitychange", onVisibility);
    window.addEventListener("beforeunload", onBeforeUnload);
    return () => {
      window.removeEventListener("pagehide", onHide);
      document.removeEventListener("visibilitychange", onVisibility);
      window.removeEventListener("beforeunload", onBeforeUnload);
    };
  }, [enabled, inspectionId]);

  return { status, schedule, flush, overwrite, discardLocal, version };
}
