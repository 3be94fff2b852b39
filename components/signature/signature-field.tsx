"use client";

import { useCallback, useEffect, useId, useRef, useState } from "react";
import type SignaturePad from "signature_pad";
import type { PointGroup } from "signature_pad";
import { SIGNATURE_PNG_MAX_CHARS, type SignatureValue } from "@/lib/schemas/signature-values";

export type { SignatureValue } from "@/lib/schemas/signature-values";

export interface SignatureFieldProps {
  /** The typed name and the drawing. `signaturePng` is a PNG data URL, or null while the box is empty. */
  value: SignatureValue;
  onChange: (value: SignatureValue) => void;
  /** Legend of the whole field, e.g. "Installer's signature". */
  label?: string;
  /** One sentence that says what signing means here; shown under the legend. */
  statement?: string;
  /** A message for the whole field (e.g. from the server), announced when it changes. */
  error?: string | null;
  /** Per-part messages, e.g. from the shared zod schema. */
  errors?: { typedName?: string; signaturePng?: string };
  disabled?: boolean;
  /** Base for the element ids; one is generated when omitted. */
  id?: string;
}

const PEN_COLOR = "#1a2126";

/**
 * A signature: the signer's full name typed, and their signature drawn with a finger, stylus or
 * mouse. The drawing keeps its strokes when the box changes size (rotation, resize), and is
 * handed out as a PNG data URL.
 */
export function SignatureField({ value, onChange, label = "Signature", statement, error, errors, disabled = false, id }: SignatureFieldProps) {
  const generatedId = useId();
  const baseId = id ?? `signature-${generatedId.replace(/:/g, "")}`;
  const nameId = `${baseId}-name`;
  const padId = `${baseId}-pad`;
  const instructionsId = `${baseId}-instructions`;
  const statusId = `${baseId}-status`;
  const errorId = `${baseId}-error`;

  const wrapperRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const padRef = useRef<SignaturePad | null>(null);
  /** CSS size the strokes were drawn at, to scale them when the box changes size. */
  const sizeRef = useRef<{ width: number; height: number } | null>(null);
  /** A drawing handed in through `value` (e.g. a restored draft), drawn as an image under new strokes. */
  const imageRef = useRef<string | null>(null);
  /** The last PNG this field emitted, so that echoing it back through `value` changes nothing. */
  const emittedRef = useRef<string | null>(null);
  const valueRef = useRef(value);
  const onChangeRef = useRef(onChange);
  valueRef.current = value;
  onChangeRef.current = onChange;

  const [hasDrawing, setHasDrawing] = useState(value.signaturePng !== null);
  /** The drawing library loads after the page; the effects that talk to the pad wait for it. */
  const [padReady, setPadReady] = useState(false);

  const exportPng = useCallback((): string | null => {
    const pad = padRef.current;
    const canvas = canvasRef.current;
    if (!pad || !canvas || (pad.isEmpty() && !imageRef.current)) return null;
    const png = pad.toDataURL("image/png");
    if (png.length <= SIGNATURE_PNG_MAX_CHARS) return png;
    // A very dense screen can make the PNG too large: export at CSS pixels instead.
    const size = sizeRef.current;
    if (!size) return png;
    const small = document.createElement("canvas");
    small.width = Math.round(size.width);
    small.height = Math.round(size.height);
    small.getContext("2d")?.drawImage(canvas, 0, 0, small.width, small.height);
    return small.toDataURL("image/png");
  }, []);

  const emit = useCallback(
    (signaturePng: string | null) => {
      emittedRef.current = signaturePng;
      setHasDrawing(signaturePng !== null);
      onChangeRef.current({ typedName: valueRef.current.typedName, signaturePng });
    },
    [],
  );

  /** Sizes the canvas to its box and the screen's pixel ratio, then redraws what was there. */
  const fitCanvas = useCallback(() => {
    const canvas = canvasRef.current;
    const pad = padRef.current;
    if (!canvas || !pad) return;
    const rect = canvas.getBoundingClientRect();
    if (rect.width === 0 || rect.height === 0) return;
    const ratio = Math.max(window.devicePixelRatio || 1, 1);
    const targetWidth = Math.round(rect.width * ratio);
    const targetHeight = Math.round(rect.height * ratio);
    const previous = sizeRef.current;
    if (previous && canvas.width === targetWidth && canvas.height === targetHeight) return;
    const strokes = pad.toData();
    canvas.width = targetWidth;
    canvas.height = targetHeight;
    canvas.getContext("2d")?.scale(ratio, ratio);
    sizeRef.current = { width: rect.width, height: rect.height };
    pad.clear();
    const sx = previous ? rect.width / previous.width : 1;
    const sy = previous ? rect.height / previous.height : 1;
    const redraw = () => {
      if (strokes.length) pad.fromData(scaleStrokes(strokes, sx, sy), { clear: false });
    };
    if (imageRef.current) void pad.fromDataURL(imageRef.current, { width: rect.width, height: rect.height }).then(redraw, redraw);
    else redraw();
  }, []);

  useEffect(() => {
    const canvas = canvasRef.current;
    const wrapper = wrapperRef.current;
    if (!canvas || !wrapper) return;
    let cancelled = false;
    let teardown: (() => void) | null = null;
    // The drawing library is fetched on mount rather than with the page's first script.
    void import("signature_pad").then(({ default: SignaturePadClass }) => {
      if (cancelled) return;
      const pad = new SignaturePadClass(canvas, { penColor: PEN_COLOR, minWidth: 0.8, maxWidth: 2.6 });
      padRef.current = pad;
      if (valueRef.current.signaturePng) {
        imageRef.current = valueRef.current.signaturePng;
        emittedRef.current = valueRef.current.signaturePng;
      }
      fitCanvas();
      const onEnd = () => emit(exportPng());
      pad.addEventListener("endStroke", onEnd);
      const observer = new ResizeObserver(() => fitCanvas());
      observer.observe(wrapper);
      window.addEventListener("resize", fitCanvas);
      teardown = () => {
        observer.disconnect();
        window.removeEventListener("resize", fitCanvas);
        pad.removeEventListener("endStroke", onEnd);
        pad.off();
        padRef.current = null;
        sizeRef.current = null;
      };
      setPadReady(true);
    });
    return () => {
      cancelled = true;
      teardown?.();
      setPadReady(false);
    };
  }, [emit, exportPng, fitCanvas]);

  useEffect(() => {
    const pad = padRef.current;
    if (!pad) return;
    if (disabled) pad.off();
    else pad.on();
  }, [disabled, padReady]);

  // A drawing set from outside: null clears the box, another PNG replaces the drawing.
  useEffect(() => {
    const pad = padRef.current;
    const incoming = value.signaturePng;
    if (!pad || incoming === emittedRef.current) return;
    emittedRef.current = incoming;
    pad.clear();
    imageRef.current = incoming;
    setHasDrawing(incoming !== null);
    const size = sizeRef.current;
    if (incoming && size) void pad.fromDataURL(incoming, { width: size.width, height: size.height });
  }, [value.signaturePng, padReady]);

  function clear() {
    padRef.current?.clear();
    imageRef.current = null;
    emit(null);
  }

  const nameError = errors?.typedName;
  const drawingError = errors?.signaturePng;

  return (
    <fieldset className="min-w-0 space-y-3" aria-describedby={statement ? `${baseId}-statement` : undefined} disabled={disabled}>
      <legend className="text-base font-bold text-ink-900">{label}</legend>
      {statement ? (
        <p id={`${baseId}-statement`} className="text-sm text-ink-700">
          {statement}
        </p>
      ) : null}

      <div>
        <label htmlFor={nameId} className="label">
          Full name
        </label>
        <input
          id={nameId}
          className="input"
          autoComplete="name"
          autoCapitalize="words"
          spellCheck={false}
          maxLength={200}
          value={value.typedName}
          aria-invalid={nameError ? true : undefined}
          aria-describedby={nameError ? `${nameId}-error` : undefined}
          onChange={(e) => onChange({ typedName: e.target.value, signaturePng: value.signaturePng })}
        />
        <p id={`${nameId}-error`} aria-live="polite" className="mt-1 text-sm font-medium text-fail">
          {nameError ?? ""}
        </p>
      </div>

      <div>
        <p id={`${padId}-label`} className="label">
          Drawn signature
        </p>
        <p id={instructionsId} className="mb-2 text-xs text-ink-500">
          Sign inside the box with a finger, a stylus or the mouse. Use Clear to start again.
        </p>
        <div ref={wrapperRef} className="relative w-full max-w-[600px]">
          <canvas
            ref={canvasRef}
            id={padId}
            role="img"
            aria-labelledby={`${padId}-label`}
            aria-describedby={`${instructionsId} ${statusId}`}
            className={`block aspect-[2/1] max-h-[200px] w-full touch-none select-none rounded-md border-2 border-dashed bg-white sm:aspect-[3/1] ${
              drawingError ? "border-fail" : "border-ink-300"
            } ${disabled ? "cursor-not-allowed opacity-60" : "cursor-crosshair"}`}
            style={{ touchAction: "none" }}
          />
          {/* The signing line is drawn outside the canvas so that it stays out of the PNG. */}
          <div aria-hidden="true" className="pointer-events-none absolute inset-x-4 bottom-[22%] flex items-end gap-1 border-b border-ink-300 text-ink-400">
            <span className="-mb-0.5 text-lg leading-none">×</span>
          </div>
        </div>
        <div className="mt-2 flex max-w-[600px] items-center justify-between gap-3">
          <p id={statusId} aria-live="polite" className="text-xs text-ink-600">
            {hasDrawing ? "Signature drawn." : "The box is empty."}
          </p>
          <button type="button" className="btn-secondary" onClick={clear} disabled={disabled || !hasDrawing} aria-label={`Clear the drawn signature (${label})`}>
            Clear
          </button>
        </div>
        <p aria-live="polite" className="mt-1 text-sm font-medium text-fail">
          {drawingError ?? ""}
        </p>
      </div>

      <div id={errorId} aria-live="assertive">
        {error ? <p className="rounded-md bg-fail-soft px-3 py-2 text-sm font-medium text-fail">{error}</p> : null}
      </div>
    </fieldset>
  );
}

function scaleStrokes(strokes: PointGroup[], sx: number, sy: number): PointGroup[] {
  if (sx === 1 && sy === 1) return strokes;
  return strokes.map((group) => ({ ...group, points: group.points.map((p) => ({ ...p, x: p.x * sx, y: p.y * sy })) }));
}
