/**
 * Standard sizes of hydraulic brake parts, metric and inch series, kept as data. Every list carries
 * its source; these series are what parts suppliers commonly stock ("common practice, no source"):
 * no public table was found. The inch master-cylinder bores 7/8 … 1-1/8 in are the ones practitioners
 * name (practitioner reports, no published source).
 */

export type PartKind = 'caliper_piston' | 'wheel_cylinder' | 'master_cylinder';

export interface SizeSeries {
  kind: PartKind;
  series: 'metric' | 'inch';
  /** Bore diameters, mm, ascending. */
  diameters_mm: readonly number[];
  /** Printed label per size ("48 mm", "1-1/8 in"). */
  labels: readonly string[];
  source: string;
}

export const CATALOGUE_SOURCE = 'common practice, no source';

const IN = 25.4;

/** Fractions of an inch in sixteenths, printed as a mixed number. */
function inchLabel(sixteenths: number): string {
  const whole = Math.floor(sixteenths / 16);
  let num = sixteenths % 16;
  let den = 16;
  while (num > 0 && num % 2 === 0) {
    num /= 2;
    den /= 2;
  }
  if (num === 0) return `${whole} in`;
  return whole > 0 ? `${whole}-${num}/${den} in` : `${num}/${den} in`;
}

function inchSeries(kind: PartKind, sixteenths: readonly number[], source = CATALOGUE_SOURCE): SizeSeries {
  return { kind, series: 'inch', diameters_mm: sixteenths.map((s) => (s / 16) * IN), labels: sixteenths.map(inchLabel), source };
}

function metricSeries(kind: PartKind, mm: readonly number[]): SizeSeries {
  return { kind, series: 'metric', diameters_mm: mm, labels: mm.map((d) => `${d} mm`), source: CATALOGUE_SOURCE };
}

export const SIZE_CATALOGUE: readonly SizeSeries[] = [
  metricSeries('caliper_piston', [30, 32, 34, 36, 38, 40, 42, 43, 44, 45, 46, 48, 50, 51, 52, 54, 57, 60, 63, 66, 70]),
  inchSeries('caliper_piston', [16, 18, 20, 22, 24, 26, 28, 30, 32, 34, 36, 38, 40, 42, 44]),
  metricSeries('wheel_cylinder', [14, 15, 16, 17, 18, 19, 20, 22, 23, 24, 25, 27, 28]),
  inchSeries('wheel_cylinder', [9, 10, 11, 12, 13, 14, 15, 16, 17, 18]),
  metricSeries('master_cylinder', [19, 20, 22, 23, 24, 25, 26, 28, 30, 32]),
  inchSeries('master_cylinder', [10, 11, 12, 13, 14, 15, 16, 17, 18, 20], `${CATALOGUE_SOURCE} (7/8 to 1-1/8 in as practitioners name them, practitioner reports, no published source)`),
];

export interface CatalogueSize {
  kind: PartKind;
  series: 'metric' | 'inch';
  diameter_mm: number;
  label: string;
  source: string;
}

function sizesOf(s: SizeSeries): CatalogueSize[] {
  return s.diameters_mm.map((d, i) => ({ kind: s.kind, series: s.series, diameter_mm: d, label: s.labels[i]!, source: s.source }));
}

/** Every catalogue size of one kind (both series), ascending. */
export function catalogueSizes(kind: PartKind): CatalogueSize[] {
  return SIZE_CATALOGUE.filter((s) => s.kind === kind)
    .flatMap(sizesOf)
    .sort((a, b) => a.diameter_mm - b.diameter_mm);
}

/** In each series, the largest size at or below the diameter and the smallest above it. */
export function nearestSizes(kind: PartKind, diameterMm: number): CatalogueSize[] {
  const out: CatalogueSize[] = [];
  for (const s of SIZE_CATALOGUE.filter((x) => x.kind === kind)) {
    const sizes = sizesOf(s);
    const below = [...sizes].reverse().find((c) => c.diameter_mm <= diameterMm);
    const above = sizes.find((c) => c.diameter_mm > diameterMm);
    if (below) out.push(below);
    if (above) out.push(above);
  }
  return out;
}
