/**
 * Thermocouple tolerances and GUM (JCGM 100:2008) helpers for a measurement-uncertainty budget.
 * Tolerance = the greater of a fixed value and a fraction of |t| (°C), over the class's range.
 * Sources: IEC 60584-1:2013 classes (Pico Technology and therncway.net tables), ASTM E230/E230M
 * limits of error above 0 °C (Pelican Wire, ASTM E230/E230M-12 tolerance table as copied on Scribd).
 */
export type ToleranceType = "K" | "J" | "T" | "N" | "E";
export type ToleranceClass = "iec-1" | "iec-2" | "iec-3" | "astm-standard" | "astm-special";

interface Band { fromC: number; toC: number; fixedC: number; fraction: number }

const K_IEC: Record<"iec-1" | "iec-2" | "iec-3", Band> = {
  "iec-1": { fromC: -40, toC: 1000, fixedC: 1.5, fraction: 0.004 },
  "iec-2": { fromC: -40, toC: 1200, fixedC: 2.5, fraction: 0.0075 },
  "iec-3": { fromC: -200, toC: 40, fixedC: 2.5, fraction: 0.015 },
};

const ASTM_K: Record<"astm-standard" | "astm-special", Band> = {
  "astm-standard": { fromC: 0, toC: 1260, fixedC: 2.2, fraction: 0.0075 },
  "astm-special": { fromC: 0, toC: 1260, fixedC: 1.1, fraction: 0.004 },
};

// Only combinations tabulated in our sources; IEC limits for type E are not among them.
const TABLE: Record<ToleranceType, Partial<Record<ToleranceClass, Band>>> = {
  K: { ...K_IEC, ...ASTM_K },
  N: { ...K_IEC, ...ASTM_K },
  J: {
    "iec-1": { fromC: -40, toC: 750, fixedC: 1.5, fraction: 0.004 },
    "iec-2": { fromC: -40, toC: 750, fixedC: 2.5, fraction: 0.0075 },
    "astm-standard": { fromC: 0, toC: 760, fixedC: 2.2, fraction: 0.0075 },
    "astm-special": { fromC: 0, toC: 760, fixedC: 1.1, fraction: 0.004 },
  },
  T: {
    "iec-1": { fromC: -40, toC: 350, fixedC: 0.5, fraction: 0.004 },
    "iec-2": { fromC: -40, toC: 350, fixedC: 1.0, fraction: 0.0075 },
    "iec-3": { fromC: -200, toC: 40, fixedC: 1.0, fraction: 0.015 },
    "astm-standard": { fromC: 0, toC: 370, fixedC: 1.0, fraction: 0.0075 },
    "astm-special": { fromC: 0, toC: 370, fixedC: 0.5, fraction: 0.004 },
  },
  E: {
    "astm-standard": { fromC: 0, toC: 870, fixedC: 1.7, fraction: 0.005 },
    "astm-special": { fromC: 0, toC: 870, fixedC: 1.0, fraction: 0.004 },
  },
};

/**
 * Tolerance (± °C, new wire, reference junction at 0 °C) of a thermocouple type and class at a
 * temperature, or null when the class does not cover that temperature or is not tabulated.
 */
export function thermocoupleTolerance(type: ToleranceType, cls: ToleranceClass, celsius: number): number | null {
  const band = TABLE[type]?.[cls];
  if (!band || !(celsius >= band.fromC && celsius <= band.toC)) return null;
  return Math.max(band.fixedC, band.fraction * Math.abs(celsius));
}

/** GUM 4.3.7: rectangular distribution of half-width a → u = a/√3. */
export function uRectangular(halfWidth: number): number {
  return halfWidth / Math.sqrt(3);
}

/** GUM 4.3.9: triangular distribution of half-width a → u = a/√6. */
export function uTriangular(halfWidth: number): number {
  return halfWidth / Math.sqrt(6);
}

/** A normal input quoted as expanded uncertainty U with coverage factor k → u = U/k. */
export function uFromExpanded(expanded: number, k: number): number {
  return expanded / k;
}

/** Type A: standard uncertainty of the mean of n readings with standard deviation s → s/√n. */
export function uOfMean(stdDev: number, n: number): number {
  return stdDev / Math.sqrt(n);
}

/** GUM 5.1.2 for uncorrelated inputs: u_c = √Σ(cᵢ·uᵢ)², sensitivity cᵢ = 1 unless given. */
export function combinedUncertainty(components: ReadonlyArray<number | { u: number; c?: number }>): number {
  let sum = 0;
  for (const item of components) {
    const u = typeof item === "number" ? item : item.u * (item.c ?? 1);
    sum += u * u;
  }
  return Math.sqrt(sum);
}

/** GUM 6.2.1: expanded uncertainty U = k·u_c (k = 2 for about 95 % coverage). */
export function expandedUncertainty(combined: number, k = 2): number {
  return k * combined;
}
