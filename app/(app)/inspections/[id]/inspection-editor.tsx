"use client";

import dynamic from "next/dynamic";
import { useRouter } from "next/navigation";
import { useDeferredValue, useEffect, useMemo, useRef, useState } from "react";
import { zodResolver } from "@hookform/resolvers/zod";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { PhotoUploader } from "@/components/photos/photo-uploader";
import { SafetyNotice } from "@/components/safety-notice";
import { useHydrated } from "@/components/ui/use-hydrated";
import { useAutosave, readLocalDraft, type SaveStatus } from "@/components/inspection/use-autosave";
import { focusPath } from "@/components/inspection/field-id";
import { apiFetch, ApiError } from "@/lib/client/api";
import { inspectionDataSchema, type InspectionData } from "@/lib/inspections/data";
import { evaluateInspectionData, type InspectionFinding } from "@/lib/inspections/evaluate";
import { prepareRulebook, type Appliance, type Finding, type RulebookContent } from "@/lib/venting";
import type { SiteCheckItemDefinition } from "@/lib/site-checks";
import { AppliancesSection } from "./appliances-section";
import { VentRunSection } from "./vent-run-section";
import { AirSection } from "./air-section";
import { ReturnAirSection } from "./return-air-section";
import { ReadingsSection } from "./readings-section";
import { SiteChecksSection } from "./site-checks-section";
import { SubmitSection } from "./submit-section";
import { FindingsPanel } from "./findings-panel";
import { Section } from "./form-bits";
import { toData, toFormValues, type InspectionFormValues } from "./form-values";

// The vent-run drawing is rendered on the server with the page; the code that redraws it as the
// fields change arrives in its own chunk, after the form's.
const VentRunDrawing = dynamic(() => import("@/components/drawing/vent-run-drawing").then((m) => m.VentRunDrawing));

const SECTIONS = [
  ["appliances", "Appliances"],
  ["ventRun", "Vent run"],
  ["airSpace", "Air"],
  ["returnAir", "Return air"],
  ["readings", "Readings"],
  ["siteChecks", "Site checks"],
  ["photos", "Photos"],
  ["submit", "Submit"],
] as const;

function SaveIndicator({ status, onRetry }: { status: SaveStatus; onRetry: () => void }) {
  // Marks when the editor has come alive in the browser (changes are then watched and saved);
  // the end-to-end tests wait for it before typing.
  const [ready, setReady] = useState(false);
  useEffect(() => setReady(true), []);
  const text =
    status.kind === "saved"
      ? status.at
        ? `Saved ${new Date(status.at).toLocaleTimeString([], { hour: "2-digit", minute: "2-digit" })}`
        : "All changes saved"
      : status.kind === "pending"
        ? "Unsaved changes…"
        : status.kind === "saving"
          ? "Saving…"
          : status.kind === "failed"
            ? `Not saved: ${status.message} Retrying.`
            : "Conflict";
  const tone = status.kind === "failed" || status.kind === "conflict" ? "bg-fail-soft text-fail" : status.kind === "saved" ? "bg-pass-soft text-pass" : "bg-ink-100 text-ink-700";
  return (
    <span role="status" aria-live="polite" className={`inline-flex items-center gap-2 rounded-full px-3 py-1 text-xs font-semibold ${tone}`} data-testid="save-status" data-ready={ready ? "true" : "false"}>
      {text}
      {status.kind === "failed" ? (
        <button type="button" className="underline" onClick={onRetry}>
          Retry now
        </button>
      ) : null}
    </span>
  );
}

export interface EditorProps {
  inspectionId: number;
  version: number;
  status: string;
  editable: boolean;
  data: InspectionData;
  rulebookContent: RulebookContent;
  rulebookLabel: string;
  siteCheckItems: SiteCheckItemDefinition[];
  jobAppliances: Appliance[];
  memberName: string;
  header: React.ReactNode;
  reviewPanel?: React.ReactNode;
}

/**
 * The installer's inspection: appliances, vent run, combustion air, readings, site checks and
 * photos, with findings computed in the browser as each field changes and saved automatically.
 */
export function InspectionEditor(props: EditorProps) {
  const router = useRouter();
  const prepared = useMemo(() => prepareRulebook(props.rulebookContent), [props.rulebookContent]);
  const [restoredLocal, setRestoredLocal] = useState(false);
  // The same schema as the server's: a value out of its range gets its message beside the field
  // as it is typed (the form's shape is the stored data's, so the paths match). Only the errors
  // are used: the values are read with toData, never through handleSubmit.
  const form = useForm<InspectionFormValues>({
    defaultValues: toFormValues(props.data),
    resolver: zodResolver(inspectionDataSchema) as unknown as Resolver<InspectionFormValues>,
    mode: "onChange",
  });
  const { control, getValues, setValue, reset } = form;
  const autosave = useAutosave({ inspectionId: props.inspectionId, initialVersion: props.version, enabled: props.editable });
  const { schedule } = autosave;
  const [submitError, setSubmitError] = useState<string | null>(null);
  const [submitting, setSubmitting] = useState(false);
  // Until the editor runs in the browser its fields are disabled: text typed into the server-
  // rendered page before then would be kept on screen but never reach the autosave.
  const hydrated = useHydrated();

  // A copy on this device that the server never received (offline, failed save) comes back first.
  const restored = useRef(false);
  useEffect(() => {
    if (restored.current || !props.editable) return;
    restored.current = true;
    const local = readLocalDraft(props.inspectionId, props.version);
    if (local) {
      const parsed = inspectionDataSchema.safeParse(local.data);
      if (parsed.success) {
        reset(toFormValues(parsed.data));
        setRestoredLocal(true);
        schedule(parsed.data);
      }
    }
  }, [props.editable, props.inspectionId, props.version, reset, schedule]);

  const values = useWatch({ control }) as InspectionFormValues;
  const deferred = useDeferredValue(values);
  const evaluation = useMemo(() => {
    const parsed = inspectionDataSchema.safeParse(toData(deferred));
    return parsed.success ? evaluateInspectionData(parsed.data, prepared, props.siteCheckItems) : null;
  }, [deferred, prepared, props.siteCheckItems]);
  const [lastGood, setLastGood] = useState(evaluation);
  useEffect(() => {
    if (evaluation) setLastGood(evaluation);
  }, [evaluation]);
  const shown = evaluation ?? lastGood;

  // Every change is kept on the device at once and sent to the server after a pause; a value
  // out of range holds the save back until it is fixed, and says so.
  const current = useMemo(() => inspectionDataSchema.safeParse(toData(values)), [values]);
  const invalid = current.success ? null : (current.error.issues[0] ?? null);
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    if (!props.editable) return;
    if (current.success) schedule(current.data);
  }, [current, props.editable, schedule]);

  const submit = async (signature: { typedName: string; signaturePng: string }) => {
    setSubmitting(true);
    setSubmitError(null);
    try {
      await autosave.flush();
      await apiFetch(`/api/inspections/${props.inspectionId}/submit`, { method: "POST", body: { version: autosave.version.current, signature } });
      autosave.discardLocal();
      router.refresh();
    } catch (error) {
      setSubmitError(error instanceof ApiError ? error.message : "The inspection could not be submitted. Try again.");
    } finally {
      setSubmitting(false);
    }
  };

  const attachOptions = [
    ...(values.ventRun?.segments ?? []).map((s, i) => ({ value: `segment:${s.id}`, label: `Segment ${i + 1}` })),
    ...props.siteCheckItems.map((item) => ({ value: `check:${item.key}`, label: item.label })),
  ];

  const findings: InspectionFinding[] = shown?.findings ?? [];

  return (
    <div className="lg:grid lg:grid-cols-[minmax(0,1fr)_22rem] lg:gap-8">
      <div className="min-w-0 space-y-6 pb-16 lg:pb-0">
        {props.header}
        <div className="flex flex-wrap items-center gap-2">
          {props.editable ? <SaveIndicator status={autosave.status} onRetry={() => void autosave.flush()} /> : null}
          {restoredLocal ? <span className="rounded-full bg-info-soft px-3 py-1 text-xs font-semibold text-info">Restored unsaved entries from this device</span> : null}
        </div>
        {props.editable && invalid ? (
          <p role="alert" className="rounded-md border border-fail/40 bg-fail-soft px-3 py-2 text-sm text-fail" data-testid="invalid-entry">
            Not saved until this is fixed: {invalid.message}{" "}
            <button type="button" className="font-semibold underline" onClick={() => focusPath(invalid.path.map(String).join("."))}>
              Show the field
            </button>
          </p>
        ) : null}
        {autosave.status.kind === "conflict" ? (
          <div role="alert" className="space-y-2 rounded-md border border-fail/40 bg-fail-soft p-3 text-sm">
            <p className="font-semibold text-fail">{autosave.status.message}</p>
            <div className="flex flex-wrap gap-2">
              <button type="button" className="btn-secondary" onClick={() => { autosave.discardLocal(); window.location.reload(); }}>
                Load the saved version (drop my changes)
              </button>
              <button type="button" className="btn-secondary" onClick={() => void autosave.overwrite()}>
                Keep my changes and save over it
              </button>
            </div>
          </div>
        ) : null}
        {props.reviewPanel}
        <SafetyNotice variant="box" />

        <nav aria-label="Inspection sections" className="sticky top-12 z-10 -mx-4 overflow-x-auto bg-ink-50/95 px-4 py-2 backdrop-blur lg:top-0">
          <ul className="flex gap-2">
            {SECTIONS.map(([id, label]) => (
              <li key={id}>
                <a href={`#${id}`} className="inline-flex min-h-[40px] items-center whitespace-nowrap rounded-full border border-ink-300 bg-white px-3 text-sm font-medium text-ink-700 hover:border-copper-500">
                  {label}
                </a>
              </li>
            ))}
          </ul>
        </nav>

        <form onSubmit={(e) => e.preventDefault()} aria-label="Inspection" aria-busy={!hydrated}>
          <fieldset disabled={!hydrated} className="min-w-0 space-y-10">
          <AppliancesSection control={control} editable={props.editable} jobAppliances={props.jobAppliances} getValues={getValues} setValue={setValue} />
          <VentRunSection
            control={control}
            editable={props.editable}
            getValues={getValues}
            sizing={shown?.sizing.ventRun ?? null}
            drawing={<VentRunDrawing ventRun={values.ventRun} appliances={values.appliances} findings={findings as unknown as Finding[]} />}
          />
          <AirSection control={control} editable={props.editable} sizing={shown?.sizing.airSpace ?? null} />
          <ReturnAirSection control={control} editable={props.editable} sizing={shown?.sizing.returnAir ?? null} findings={findings} />
          <ReadingsSection control={control} editable={props.editable} setValue={setValue} />
          <SiteChecksSection control={control} editable={props.editable} items={props.siteCheckItems} />
          <Section id="photos" title="Photos">
            <PhotoUploader inspectionId={props.inspectionId} editable={props.editable} attachOptions={attachOptions} />
          </Section>
          <Section id="notes" title="Notes">
            <label htmlFor="f-notes" className="sr-only">
              Notes
            </label>
            <textarea id="f-notes" rows={3} className="input" disabled={!props.editable} placeholder="Anything the supervisor or the homeowner should know" {...form.register("notes")} />
          </Section>
          {props.editable ? <SubmitSection control={control} findings={findings} onSubmit={submit} busy={submitting} error={submitError} defaultName={props.memberName} /> : null}
          </fieldset>
        </form>
      </div>
      {shown ? <FindingsPanel findings={findings} summary={shown.summary} rulebookLabel={props.rulebookLabel} /> : null}
    </div>
  );
}
