/**
 * NIST ITS-90 thermocouple reference functions (NIST SRD 60 / Monograph 175) for types K, J, T.
 * Forward: E(t) in mV for t in °C. Inverse: the approximate inverse polynomials t(E) with their
 * published voltage ranges; outside those ranges the inverse answers null.
 */
export type ThermocoupleType = "K" | "J" | "T";
export const THERMOCOUPLE_TYPES: readonly ThermocoupleType[] = ["K", "J", "T"];

interface ForwardRange { fromC: number; toC: number; c: readonly number[]; exp?: readonly [number, number, number] }
interface InverseRange { fromMv: number; toMv: number; d: readonly number[]; errorC: readonly [number, number] }

const FORWARD: Record<ThermocoupleType, readonly ForwardRange[]> = {
  K: [
    { fromC: -270, toC: 0, c: [0, 0.39450128025e-1, 0.236223735980e-4, -0.328589067840e-6, -0.499048287770e-8,
      -0.675090591730e-10, -0.574103274280e-12, -0.310888728940e-14, -0.104516093650e-16, -0.198892668780e-19,
      -0.163226974860e-22] },
    { fromC: 0, toC: 1372, c: [-0.176004136860e-1, 0.389212049750e-1, 0.185587700320e-4, -0.994575928740e-7,
      0.318409457190e-9, -0.560728448890e-12, 0.560750590590e-15, -0.320207200030e-18, 0.971511471520e-22,
      -0.121047212750e-25], exp: [0.1185976, -0.1183432e-3, 0.1269686e3] },
  ],
  J: [
    { fromC: -210, toC: 760, c: [0, 0.503811878150e-1, 0.304758369300e-4, -0.856810657200e-7, 0.132281952950e-9,
      -0.170529583370e-12, 0.209480906970e-15, -0.125383953360e-18, 0.156317256970e-22] },
    { fromC: 760, toC: 1200, c: [0.296456256810e3, -0.149761277860e1, 0.317871039240e-2, -0.318476867010e-5,
      0.157208190040e-8, -0.306913690560e-12] },
  ],
  T: [
    { fromC: -270, toC: 0, c: [0, 0.387481063640e-1, 0.441944343470e-4, 0.118443231050e-6, 0.200329735540e-7,
      0.901380195590e-9, 0.226511565930e-10, 0.360711542050e-12, 0.384939398830e-14, 0.282135219250e-16,
      0.142515947790e-18, 0.487686622860e-21, 0.107955392700e-23, 0.139450270620e-26, 0.797951539270e-30] },
    { fromC: 0, toC: 400, c: [0, 0.387481063640e-1, 0.332922278800e-4, 0.206182434040e-6, -0.218822568460e-8,
      0.109968809280e-10, -0.308157587720e-13, 0.454791352900e-16, -0.275129016730e-19] },
  ],
};

const INVERSE: Record<ThermocoupleType, readonly InverseRange[]> = {
  K: [
    { fromMv: -5.891, toMv: 0, errorC: [-0.02, 0.04], d: [0, 2.5173462e1, -1.1662878, -1.0833638, -8.977354e-1,
      -3.7342377e-1, -8.6632643e-2, -1.0450598e-2, -5.1920577e-4] },
    { fromMv: 0, toMv: 20.644, errorC: [-0.05, 0.04], d: [0, 2.508355e1, 7.860106e-2, -2.503131e-1, 8.31527e-2,
      -1.228034e-2, 9.804036e-4, -4.41303e-5, 1.057734e-6, -1.052755e-8] },
    { fromMv: 20.644, toMv: 54.886, errorC: [-0.05, 0.06], d: [-1.318058e2, 4.830222e1, -1.646031, 5.464731e-2,
      -9.650715e-4, 8.802193e-6, -3.11081e-8] },
  ],
  J: [
    { fromMv: -8.095, toMv: 0, errorC: [-0.05, 0.03], d: [0, 1.9528268e1, -1.2286185, -1.0752178, -5.9086933e-1,
      -1.7256713e-1, -2.8131513e-2, -2.396337e-3, -8.3823321e-5] },
    { fromMv: 0, toMv: 42.919, errorC: [-0.04, 0.04], d: [0, 1.978425e1, -2.001204e-1, 1.036969e-2, -2.549687e-4,
      3.585153e-6, -5.344285e-8, 5.09989e-10] },
    { fromMv: 42.919, toMv: 69.553, errorC: [-0.04, 0.03], d: [-3.11358187e3, 3.00543684e2, -9.9477323,
      1.7027663e-1, -1.43033468e-3, 4.73886084e-6] },
  ],
  T: [
    { fromMv: -5.603, toMv: 0, errorC: [-0.02, 0.04], d: [0, 2.5949192e1, -2.1316967e-1, 7.9018692e-1, 4.2527777e-1,
      1.3304473e-1, 2.0241446e-2, 1.2668171e-3] },
    { fromMv: 0, toMv: 20.872, errorC: [-0.03, 0.03], d: [0, 2.5928e1, -7.602961e-1, 4.637791e-2, -2.165394e-3,
      6.048144e-5, -7.293422e-7] },
  ],
};

function horner(coefficients: readonly number[], x: number): number {
  let sum = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) sum = sum * x + coefficients[i];
  return sum;
}

/** Temperature range (°C) of the forward reference function. */
export function forwardRange(type: ThermocoupleType): { fromC: number; toC: number } {
  const ranges = FORWARD[type];
  return { fromC: ranges[0].fromC, toC: ranges[ranges.length - 1].toC };
}

/** Voltage range (mV) covered by the inverse polynomials. */
export function inverseRange(type: ThermocoupleType): { fromMv: number; toMv: number } {
  const ranges = INVERSE[type];
  return { fromMv: ranges[0].fromMv, toMv: ranges[ranges.length - 1].toMv };
}

/** NIST's stated error band (°C) of the inverse polynomial used for `millivolts`, or null outside. */
export function inverseErrorBand(type: ThermocoupleType, millivolts: number): readonly [number, number] | null {
  const range = INVERSE[type].find((r) => millivolts >= r.fromMv && millivolts <= r.toMv);
  return range ? range.errorC : null;
}

/** E(t) in mV (reference junction at 0 °C); null outside the function's temperature range. */
export function emfMillivolts(type: ThermocoupleType, celsius: number): number | null {
  const ranges = FORWARD[type];
  for (const range of ranges) {
    if (celsius >= range.fromC && celsius <= range.toC) {
      let e = horner(range.c, celsius);
      if (range.exp) {
        const [a0, a1, a2] = range.exp;
        e += a0 * Math.exp(a1 * (celsius - a2) * (celsius - a2));
      }
      return e;
    }
  }
  return null;
}

/** t(E) in °C from the inverse polynomials (reference junction at 0 °C); null outside their range. */
export function celsiusFromEmf(type: ThermocoupleType, millivolts: number): number | null {
  const ranges = INVERSE[type];
  for (let i = 0; i < ranges.length; i++) {
    const range = ranges[i];
    if (millivolts >= range.fromMv && millivolts <= range.toMv) return horner(range.d, millivolts);
  }
  // NIST rounds the outer voltage limits to 0.001 mV (e.g. E(−200 °C) = −5.8914 mV for type K
  // against a stated −5.891); accept that rounding at the two ends.
  const first = ranges[0];
  const last = ranges[ranges.length - 1];
  if (millivolts < first.fromMv && millivolts >= first.fromMv - END_SLACK_MV) return horner(first.d, millivolts);
  if (millivolts > last.toMv && millivolts <= last.toMv + END_SLACK_MV) return horner(last.d, millivolts);
  return null;
}

const END_SLACK_MV = 0.0005;

/**
 * A converter from measured thermocouple voltage to hot-junction temperature when the reference
 * (cold) junction sat at `coldJunctionC`: t = inverse(E + forward(coldJunctionC)). Adding the cold
 * junction temperature to t(E) instead is wrong because E(t) is not linear.
 */
export function millivoltConverter(type: ThermocoupleType, coldJunctionC = 0): (millivolts: number) => number | null {
  const offset = emfMillivolts(type, coldJunctionC);
  if (offset === null) throw new RangeError(`Cold-junction temperature ${coldJunctionC} °C is outside the type ${type} range.`);
  return (millivolts: number) => celsiusFromEmf(type, millivolts + offset);
}
