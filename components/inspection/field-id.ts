/** The DOM id of the control for an input path (`ventRun.segments.1.riseIn` → `f-ventRun-segments-1-riseIn`), so a finding can jump to its field. */
export function fieldId(path: string): string {
  return `f-${path.replace(/[^A-Za-z0-9_-]+/g, "-")}`;
}

/** Scrolls to and focuses the control of a path, or the nearest enclosing section that exists. */
export function focusPath(path: string): boolean {
  const parts = path.split(".");
  for (let n = parts.length; n > 0; n--) {
    const el = document.getElementById(fieldId(parts.slice(0, n).join(".")));
    if (el) {
      el.scrollIntoView({ behavior: "smooth", block: "center" });
      if (el instanceof HTMLInputElement || el instanceof HTMLSelectElement || el instanceof HTMLTextAreaElement || el instanceof HTMLButtonElement) {
        el.focus({ preventScroll: true });
      } else {
        el.setAttribute("tabindex", "-1");
        el.focus({ preventScroll: true });
      }
      el.classList.add("ring-4", "ring-copper-300");
      window.setTimeout(() => el.classList.remove("ring-4", "ring-copper-300"), 1600);
      return true;
    }
  }
  return false;
}
