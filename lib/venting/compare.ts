/** Tolerance for comparing a computed value with a limit, so that values exactly at a limit pass. */
export const EPSILON = 1e-9;

/** `a ≥ b` with a tolerance for floating-point noise. */
export const atLeast = (a: number, b: number): boolean => a >= b - EPSILON * Math.max(1, Math.abs(b));
/** `a ≤ b` with a tolerance for floating-point noise. */
export const atMost = (a: number, b: number): boolean => a <= b + EPSILON * Math.max(1, Math.abs(b));
