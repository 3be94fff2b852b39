"use client";

import { useCallback, useEffect, useId, useRef, useState, type ChangeEvent } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { withQueryClient } from "@/components/query-client";
import { ApiError, apiFetch } from "@/lib/client/api";
import {
  MAX_CAPTION_LENGTH,
  MAX_PHOTO_BYTES,
  PHOTO_MESSAGES,
  PHOTO_TAGS,
  PHOTO_TAG_LABELS,
  attachmentValue,
  formatMegabytes,
  parseAttachmentValue,
  type PhotoJson,
  type PhotoTag,
} from "@/lib/schemas/photo-values";
import type { PhotoUpdateValues } from "@/lib/schemas/photo";

export interface AttachOption {
  /** `segment:<id>` or `check:<key>`. */
  value: string;
  label: string;
}

export interface PhotoUploaderProps {
  inspectionId: number;
  editable: boolean;
  attachOptions: AttachOption[];
  initialPhotos?: PhotoJson[];
}

/** Parallel uploads at once: enough to keep a phone's uplink busy without flooding the server. */
const PARALLEL_UPLOADS = 3;

type UploadStatus = "queued" | "uploading" | "processing" | "error";

interface UploadItem {
  localId: string;
  file: File;
  loaded: number;
  status: UploadStatus;
  message?: string;
  retryable?: boolean;
}

function photosKey(inspectionId: number) {
  return ["photos", inspectionId] as const;
}

/** One XMLHttpRequest per file, because fetch cannot report upload progress. */
function sendPhoto(
  inspectionId: number,
  file: File,
  onProgress: (loaded: number) => void,
  register: (xhr: XMLHttpRequest) => void,
): Promise<PhotoJson> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    register(xhr);
    xhr.open("POST", `/api/inspections/${inspectionId}/photos`);
    xhr.setRequestHeader("Accept", "application/json");
    xhr.responseType = "text";
    xhr.upload.onprogress = (event) => onProgress(event.lengthComputable ? Math.min(event.loaded, file.size) : 0);
    xhr.onload = () => {
      let data: unknown = null;
      try {
        data = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        data = null;
      }
      if (xhr.status === 201) return resolve((data as { photo: PhotoJson }).photo);
      const error = (data as { error?: { code?: string; message?: string } } | null)?.error;
      if (xhr.status === 401) window.location.assign("/sign-in");
      reject(new ApiError(xhr.status, error?.code ?? "http_error", error?.message ?? `The server answered ${xhr.status}.`));
    };
    xhr.onerror = () => reject(new ApiError(0, "network_error", "Could not reach Flueward. Check the connection and try again."));
    xhr.onabort = () => reject(new ApiError(0, "aborted", "Upload cancelled."));
    const form = new FormData();
    form.append("file", file);
    xhr.send(form);
  });
}

/**
 * Photos of one inspection: take or choose several at once, watch each upload, fix or dismiss
 * the ones refused, then caption, tag and attach each photo. Changes save as they are made.
 */
function PhotoUploaderView({ inspectionId, editable, attachOptions, initialPhotos }: PhotoUploaderProps) {
  const queryClient = useQueryClient();
  const baseId = useId();
  const query = useQuery({
    queryKey: photosKey(inspectionId),
    queryFn: ({ signal }) => apiFetch<{ photos: PhotoJson[] }>(`/api/inspections/${inspectionId}/photos`, { signal }).then((r) => r.photos),
    initialData: initialPhotos,
  });

  const [uploads, setUploads] = useState<UploadItem[]>([]);
  const queueRef = useRef<UploadItem[]>([]);
  const activeRef = useRef(0);
  const requestsRef = useRef(new Map<string, XMLHttpRequest>());

  useEffect(() => {
    const requests = requestsRef.current;
    return () => {
      for (const xhr of requests.values()) xhr.abort();
    };
  }, []);

  const patchUpload = useCallback((localId: string, change: Partial<UploadItem>) => {
    setUploads((items) => items.map((item) => (item.localId === localId ? { ...item, ...change } : item)));
  }, []);

  const pump = useCallback(() => {
    while (activeRef.current < PARALLEL_UPLOADS && queueRef.current.length > 0) {
      const item = queueRef.current.shift()!;
      activeRef.current += 1;
      patchUpload(item.localId, { status: "uploading", loaded: 0, message: undefined });
      sendPhoto(
        inspectionId,
        item.file,
        (loaded) => patchUpload(item.localId, loaded >= item.file.size ? { loaded, status: "processing" } : { loaded }),
        (xhr) => requestsRef.current.set(item.localId, xhr),
      )
        .then((photo) => {
          queryClient.setQueryData<PhotoJson[]>(photosKey(inspectionId), (old) => [...(old ?? []).filter((p) => p.id !== photo.id), photo]);
          setUploads((items) => items.filter((i) => i.localId !== item.localId));
        })
        .catch((error: unknown) => {
          if (error instanceof ApiError && error.code === "aborted") {
            setUploads((items) => items.filter((i) => i.localId !== item.localId));
            return;
          }
          const apiError = error instanceof ApiError ? error : null;
          patchUpload(item.localId, {
            status: "error",
            message: apiError?.message ?? "The upload failed. Try again.",
            retryable: !apiError || apiError.status === 0 || apiError.status >= 500 || apiError.status === 409,
          });
        })
        .finally(() => {
          requestsRef.current.delete(item.localId);
          activeRef.current -= 1;
          pump();
        });
    }
  }, [inspectionId, patchUpload, queryClient]);

  const addFiles = useCallback(
    (files: FileList | null) => {
      if (!files || files.length === 0) return;
      const items: UploadItem[] = Array.from(files).map((file) => {
        const localId = `${Date.now()}-${Math.random().toString(36).slice(2)}`;
        if (file.size > MAX_PHOTO_BYTES) return { localId, file, loaded: 0, status: "error", message: PHOTO_MESSAGES.tooLarge(file.size), retryable: false };
        if (file.size === 0) return { localId, file, loaded: 0, status: "error", message: PHOTO_MESSAGES.empty, retryable: false };
        return { localId, file, loaded: 0, status: "queued" };
      });
      setUploads((current) => [...current, ...items]);
      queueRef.current.push(...items.filter((i) => i.status === "queued"));
      pump();
    },
    [pump],
  );

  const onChoose = (event: ChangeEvent<HTMLInputElement>) => {
    addFiles(event.target.files);
    // Cleared so choosing the same file again (after fixing it) fires change again.
    event.target.value = "";
  };

  const retry = (item: UploadItem) => {
    patchUpload(item.localId, { status: "queued", message: undefined, loaded: 0 });
    queueRef.current.push(item);
    pump();
  };
  const dismiss = (localId: string) => setUploads((items) => items.filter((i) => i.localId !== localId));
  const cancel = (localId: string) => {
    const xhr = requestsRef.current.get(localId);
    if (xhr) xhr.abort();
    else {
      queueRef.current = queueRef.current.filter((i) => i.localId !== localId);
      dismiss(localId);
    }
  };

  const photos = query.data ?? [];
  const busy = uploads.some((u) => u.status !== "error");

  return (
    <div className="space-y-4" data-testid="photo-uploader">
      {editable ? (
        <div className="space-y-2">
          <div className="flex flex-wrap gap-2">
            <label className="btn-primary cursor-pointer focus-within:ring-2 focus-within:ring-copper-500 focus-within:ring-offset-2">
              <CameraIcon />
              Take photos
              <input
                type="file"
                accept="image/*"
                multiple
                capture="environment"
                className="sr-only"
                onChange={onChoose}
                aria-label="Take photos with the camera"
                data-testid="photo-camera-input"
              />
            </label>
            <label className="btn-secondary cursor-pointer focus-within:ring-2 focus-within:ring-copper-500 focus-within:ring-offset-2">
              Choose files
              <input
                type="file"
                accept="image/jpeg,image/png,image/webp,image/heic,image/heif,image/*"
                multiple
                className="sr-only"
                onChange={onChoose}
                aria-label="Choose photo files"
                data-testid="photo-file-input"
              />
            </label>
          </div>
          <p className="text-xs text-ink-500">
            JPEG, PNG, WebP or HEIC, up to {MAX_PHOTO_BYTES / (1024 * 1024)} MB each. Photos are turned upright and their location data is removed.
          </p>
        </div>
      ) : null}

      {uploads.length > 0 ? (
        <ul className="space-y-2" aria-label="Uploads" aria-busy={busy}>
          {uploads.map((item) => (
            <UploadRow key={item.localId} item={item} onRetry={() => retry(item)} onDismiss={() => dismiss(item.localId)} onCancel={() => cancel(item.localId)} />
          ))}
        </ul>
      ) : null}

      {query.isError ? (
        <div role="alert" className="rounded-lg border border-fail/30 bg-fail-soft px-4 py-3 text-sm text-fail">
          <p className="font-semibold">The photos could not be loaded.</p>
          <p className="mt-1 text-ink-800">{query.error instanceof Error ? query.error.message : ""}</p>
          <button type="button" className="btn-secondary mt-2" onClick={() => void query.refetch()}>
            Try again
          </button>
        </div>
      ) : query.isPending ? (
        <div aria-busy="true" aria-label="Loading photos" className="grid grid-cols-1 gap-3 sm:grid-cols-2">
          {[0, 1].map((i) => (
            <div key={i} className="h-28 animate-pulse rounded-lg bg-ink-100" />
          ))}
        </div>
      ) : photos.length === 0 ? (
        <p className="rounded-lg border border-dashed border-ink-300 px-4 py-6 text-center text-sm text-ink-600">
          {editable ? "No photos yet. Take or choose photos of the connector, vent, termination and site checks." : "No photos were added."}
        </p>
      ) : (
        <ul className="grid grid-cols-1 gap-3 sm:grid-cols-2" aria-label="Photos">
          {photos.map((photo, index) => (
            <PhotoCard key={photo.id} idBase={`${baseId}-${photo.id}`} photo={photo} index={index} inspectionId={inspectionId} editable={editable} attachOptions={attachOptions} />
          ))}
        </ul>
      )}
    </div>
  );
}

function UploadRow({ item, onRetry, onDismiss, onCancel }: { item: UploadItem; onRetry: () => void; onDismiss: () => void; onCancel: () => void }) {
  const percent = item.file.size > 0 ? Math.round((item.loaded / item.file.size) * 100) : 0;
  const failed = item.status === "error";
  return (
    <li className={`card px-3 py-2 ${failed ? "border-fail/40 bg-fail-soft" : ""}`} data-testid="photo-upload-row">
      <div className="flex items-center justify-between gap-2">
        <p className="min-w-0 truncate text-sm font-medium text-ink-800" title={item.file.name}>
          {item.file.name || "Photo"} <span className="font-normal text-ink-500">· {formatMegabytes(item.file.size)}</span>
        </p>
        <div className="flex shrink-0 gap-1">
          {failed && item.retryable ? (
            <button type="button" className="btn-ghost min-h-[36px] px-2 py-1 text-xs" onClick={onRetry}>
              Retry
            </button>
          ) : null}
          <button type="button" className="btn-ghost min-h-[36px] px-2 py-1 text-xs" onClick={failed ? onDismiss : onCancel} aria-label={`${failed ? "Dismiss" : "Cancel"} ${item.file.name}`}>
            {failed ? "Dismiss" : "Cancel"}
          </button>
        </div>
      </div>
      {failed ? (
        <p role="alert" className="mt-1 text-sm text-fail" data-testid="photo-upload-error">
          {item.message}
        </p>
      ) : (
        <>
          <div
            className="mt-2 h-2 overflow-hidden rounded-full bg-ink-100"
            role="progressbar"
            aria-label={`Uploading ${item.file.name}`}
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={percent}
          >
            <div className={`h-full rounded-full transition-[width] ${item.status === "processing" ? "animate-pulse bg-copper-400" : "bg-copper-600"}`} style={{ width: `${item.status === "queued" ? 0 : percent}%` }} />
          </div>
          <p className="mt-1 text-xs text-ink-500" aria-live="polite">
            {item.status === "queued" ? "Waiting…" : item.status === "processing" ? "Checking and preparing the photo…" : `${percent}%`}
          </p>
        </>
      )}
    </li>
  );
}

type SaveState = { kind: "idle" } | { kind: "saving" } | { kind: "saved" } | { kind: "error"; message: string };

function PhotoCard({
  idBase,
  photo,
  index,
  inspectionId,
  editable,
  attachOptions,
}: {
  idBase: string;
  photo: PhotoJson;
  index: number;
  inspectionId: number;
  editable: boolean;
  attachOptions: AttachOption[];
}) {
  const queryClient = useQueryClient();
  const [caption, setCaption] = useState(photo.caption);
  const [save, setSave] = useState<SaveState>({ kind: "idle" });
  const [confirmDelete, setConfirmDelete] = useState(false);
  const [deleting, setDeleting] = useState(false);

  useEffect(() => setCaption(photo.caption), [photo.caption]);

  const replace = (next: PhotoJson) => queryClient.setQueryData<PhotoJson[]>(photosKey(inspectionId), (old) => (old ?? []).map((p) => (p.id === next.id ? next : p)));

  const patch = async (values: PhotoUpdateValues) => {
    setSave({ kind: "saving" });
    try {
      const { photo: next } = await apiFetch<{ photo: PhotoJson }>(photo.urls.full, { method: "PATCH", body: values });
      replace(next);
      setSave({ kind: "saved" });
    } catch (error) {
      const message = error instanceof ApiError ? (Object.values(error.fields)[0] ?? error.message) : "Could not save. Try again.";
      setSave({ kind: "error", message });
    }
  };

  const onCaptionBlur = () => {
    const next = caption.trim();
    if (next === photo.caption) return;
    void patch({ caption: next });
  };

  const onDelete = async () => {
    setDeleting(true);
    try {
      await apiFetch<null>(photo.urls.full, { method: "DELETE" });
      queryClient.setQueryData<PhotoJson[]>(photosKey(inspectionId), (old) => (old ?? []).filter((p) => p.id !== photo.id));
    } catch (error) {
      setDeleting(false);
      setConfirmDelete(false);
      setSave({ kind: "error", message: error instanceof ApiError ? error.message : "Could not delete. Try again." });
    }
  };

  const currentAttach = attachmentValue(photo);
  const options = currentAttach && !attachOptions.some((o) => o.value === currentAttach) ? [...attachOptions, { value: currentAttach, label: `${currentAttach.replace(/^\w+:/, "")} (no longer in this inspection)` }] : attachOptions;
  const attachLabel = options.find((o) => o.value === currentAttach)?.label;
  const alt = photo.caption || `Photo ${index + 1}`;

  return (
    <li className="card flex gap-3 p-3" data-testid="photo-card">
      <a href={photo.urls.full} target="_blank" rel="noopener noreferrer" className="shrink-0 self-start" aria-label={`Open ${alt} full size`}>
        {/* eslint-disable-next-line @next/next/no-img-element -- served by our own route with auth cookies; next/image would proxy it */}
        <img src={photo.urls.thumb} alt={alt} width={96} height={96} loading="lazy" className="h-24 w-24 rounded-md bg-ink-100 object-cover" />
      </a>
      <div className="min-w-0 flex-1 space-y-2">
        {editable ? (
          <>
            <div>
              <label htmlFor={`${idBase}-caption`} className="sr-only">
                Caption for photo {index + 1}
              </label>
              <input
                id={`${idBase}-caption`}
                className="input py-1.5 text-sm"
                placeholder="Caption (e.g. Flue collar before)"
                value={caption}
                maxLength={MAX_CAPTION_LENGTH}
                onChange={(e) => setCaption(e.target.value)}
                onBlur={onCaptionBlur}
                onKeyDown={(e) => {
                  if (e.key === "Enter") (e.target as HTMLInputElement).blur();
                }}
              />
            </div>
            <div className="grid grid-cols-1 gap-2 min-[420px]:grid-cols-2">
              <div>
                <label htmlFor={`${idBase}-tag`} className="sr-only">
                  Tag
                </label>
                <select id={`${idBase}-tag`} className="input py-1.5 text-sm" value={photo.tag} onChange={(e) => void patch({ tag: e.target.value as PhotoTag })}>
                  {PHOTO_TAGS.map((tag) => (
                    <option key={tag} value={tag}>
                      {PHOTO_TAG_LABELS[tag]}
                    </option>
                  ))}
                </select>
              </div>
              <div>
                <label htmlFor={`${idBase}-attach`} className="sr-only">
                  Attach to
                </label>
                <select id={`${idBase}-attach`} className="input py-1.5 text-sm" value={currentAttach} onChange={(e) => void patch(parseAttachmentValue(e.target.value))}>
                  <option value="">Not attached</option>
                  {options.map((o) => (
                    <option key={o.value} value={o.value}>
                      {o.label}
                    </option>
                  ))}
                </select>
              </div>
            </div>
            <div className="flex items-center justify-between gap-2">
              <p className={`text-xs ${save.kind === "error" ? "font-medium text-fail" : "text-ink-500"}`} aria-live="polite" role={save.kind === "error" ? "alert" : undefined}>
                {save.kind === "saving" ? "Saving…" : save.kind === "saved" ? "Saved" : save.kind === "error" ? save.message : `${photo.width} × ${photo.height}`}
              </p>
              {confirmDelete ? (
                <span className="flex gap-1">
                  <button type="button" className="btn-danger min-h-[36px] px-2 py-1 text-xs" onClick={() => void onDelete()} disabled={deleting}>
                    {deleting ? "Deleting…" : "Delete photo"}
                  </button>
                  <button type="button" className="btn-ghost min-h-[36px] px-2 py-1 text-xs" onClick={() => setConfirmDelete(false)} disabled={deleting}>
                    Keep
                  </button>
                </span>
              ) : (
                <button type="button" className="btn-ghost min-h-[36px] px-2 py-1 text-xs text-fail" onClick={() => setConfirmDelete(true)} aria-label={`Delete ${alt}`}>
                  Delete
                </button>
              )}
            </div>
          </>
        ) : (
          <>
            <p className="break-words text-sm text-ink-800">{photo.caption || <span className="text-ink-500">No caption</span>}</p>
            <div className="flex flex-wrap gap-1 text-xs">
              {photo.tag !== "none" ? <span className="rounded-full bg-copper-50 px-2 py-0.5 font-medium text-copper-800">{PHOTO_TAG_LABELS[photo.tag]}</span> : null}
              {attachLabel ? <span className="rounded-full bg-ink-100 px-2 py-0.5 text-ink-700">{attachLabel}</span> : null}
            </div>
          </>
        )}
      </div>
    </li>
  );
}

function CameraIcon() {
  return (
    <svg aria-hidden="true" viewBox="0 0 24 24" className="h-5 w-5" fill="none" stroke="currentColor" strokeWidth={2} strokeLinecap="round" strokeLinejoin="round">
      <path d="M4 8h3l2-3h6l2 3h3v11H4z" />
      <circle cx="12" cy="13" r="3.5" />
    </svg>
  );
}

export const PhotoUploader = withQueryClient(PhotoUploaderView);
