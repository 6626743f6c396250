/**
 * Packs aligned curves compactly for run_sample: Float32 little-endian, channel-major.
 * Float32 keeps about 7 significant digits (0.0001 °C at 300 °C) — far below any logger's resolution.
 */
export interface PackedSamples {
  rows: number;
  channels: number;
  time: Buffer;
  values: Buffer;
}

function toLittleEndian(f: Float32Array): Buffer {
  const out = Buffer.alloc(f.length * 4);
  for (let i = 0; i < f.length; i++) out.writeFloatLE(f[i], i * 4);
  return out;
}

function fromLittleEndian(b: Uint8Array): Float32Array {
  const view = new DataView(b.buffer, b.byteOffset, b.byteLength);
  const out = new Float32Array(b.byteLength / 4);
  for (let i = 0; i < out.length; i++) out[i] = view.getFloat32(i * 4, true);
  return out;
}

export function packSamples(time: ArrayLike<number>, channels: ReadonlyArray<ArrayLike<number>>): PackedSamples {
  const rows = time.length;
  const values = new Float32Array(rows * channels.length);
  channels.forEach((c, i) => {
    for (let k = 0; k < rows; k++) values[i * rows + k] = c[k];
  });
  return { rows, channels: channels.length, time: toLittleEndian(Float32Array.from(time)), values: toLittleEndian(values) };
}

export function unpackSamples(p: { rows: number; channels: number; time: Uint8Array; values: Uint8Array }): { time: Float64Array; channels: Float64Array[] } {
  const time = Float64Array.from(fromLittleEndian(p.time));
  const all = fromLittleEndian(p.values);
  const channels = Array.from({ length: p.channels }, (_, i) => Float64Array.from(all.subarray(i * p.rows, (i + 1) * p.rows)));
  return { time, channels };
}
