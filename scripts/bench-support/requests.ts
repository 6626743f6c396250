import { runToCsv, simulateReflowRun } from "@/lib/thermal/synthetic-profile";

/** A 7-minute, 8-probe, 1 Hz logger file; each seed gives a different one. */
export function loggerCsv(seed: number): string {
  return runToCsv(simulateReflowRun({ probes: 8, sampleHz: 1, durationSeconds: 420, seed }));
}

/** A multipart body by hand, for autocannon, which sends bytes as given. */
export function multipartBody(boundary: string, csv: string, fields: Record<string, string>): Buffer {
  const parts = Object.entries(fields).map(([k, v]) => `--${boundary}\r\nContent-Disposition: form-data; name="${k}"\r\n\r\n${v}\r\n`);
  parts.push(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="bench.csv"\r\nContent-Type: text/csv\r\n\r\n${csv}\r\n--${boundary}--\r\n`);
  return Buffer.from(parts.join(""), "utf8");
}

export type Timings = { server: number[]; wall: number[] };

/** Nearest-rank percentile (p in 0–100) of a list of figures. */
export function percentile(xs: number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.max(0, Math.ceil((p / 100) * s.length) - 1)];
}

/**
 * Sends requests one after another (a warm-up first, not counted) and records, for each, the
 * server's own time from its Server-Timing header and the round trip seen here. A response
 * that is not 2xx stops the benchmark: timing an error page measures nothing.
 */
export async function timeRequests(count: number, warmUp: number, make: (i: number) => { url: string; init?: RequestInit }): Promise<Timings> {
  const out: Timings = { server: [], wall: [] };
  for (let i = 0; i < warmUp + count; i++) {
    const { url, init } = make(i);
    const started = performance.now();
    const res = await fetch(url, init);
    const body = await res.text();
    const wall = performance.now() - started;
    if (!res.ok) throw new Error(`${init?.method ?? "GET"} ${url} answered ${res.status}: ${body.slice(0, 300)}`);
    const dur = /app;dur=([\d.]+)/.exec(res.headers.get("server-timing") ?? "");
    if (!dur) throw new Error(`${url} sent no Server-Timing header; is the build older than this benchmark? Run "npm run build".`);
    if (i >= warmUp) {
      out.server.push(Number(dur[1]));
      out.wall.push(wall);
    }
  }
  return out;
}
