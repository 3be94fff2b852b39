/**
 * Rise a horizontal connector segment needs: its horizontal length times the minimum slope.
 * @param lengthFt horizontal length, ft
 * @param minSlopeInPerFt minimum rise per foot, in/ft
 * @returns required rise, in
 */
export function requiredRiseIn(lengthFt: number, minSlopeInPerFt: number): number {
  return lengthFt * minSlopeInPerFt;
}

/**
 * Supports a segment needs so that no span exceeds the maximum spacing: length ÷ spacing,
 * rounded up (a span exactly at the spacing needs no extra support).
 * @param lengthFt segment length, ft
 * @param maxSpacingFt longest allowed span, ft
 */
export function supportsNeeded(lengthFt: number, maxSpacingFt: number): number {
  if (lengthFt <= 0) return 0;
  if (maxSpacingFt <= 0) return Number.POSITIVE_INFINITY;
  // Tolerance keeps 10 / (10/3) from becoming 3.0000000004 → 4.
  return Math.ceil(lengthFt / maxSpacingFt - 1e-9);
}
