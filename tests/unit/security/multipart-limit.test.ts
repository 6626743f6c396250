import { describe, expect, it } from "vitest";
import { readMultipart } from "@/lib/api";

// A multipart body sent without Content-Length (chunked) is counted as it arrives: over the limit
// it is refused as too large instead of being read whole into memory.
function chunkedMultipart(fileBytes: number) {
  const boundary = "----ovenward-test-boundary";
  const head = new TextEncoder().encode(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="run.csv"\r\nContent-Type: text/csv\r\n\r\n`);
  const tail = new TextEncoder().encode(`\r\n--${boundary}--\r\n`);
  const chunk = new Uint8Array(64 * 1024).fill(0x31);
  let sent = 0;
  let pulled = 0;
  const body = new ReadableStream<Uint8Array>({
    pull(ctl) {
      pulled++;
      if (pulled === 1) return ctl.enqueue(head);
      if (sent < fileBytes) {
        const n = Math.min(chunk.length, fileBytes - sent);
        sent += n;
        return ctl.enqueue(chunk.subarray(0, n));
      }
      ctl.enqueue(tail);
      ctl.close();
    },
  });
  const req = new Request("http://localhost/api/v1/profiles/analyze", {
    method: "POST",
    headers: { "content-type": `multipart/form-data; boundary=${boundary}` },
    body,
    duplex: "half",
  } as RequestInit);
  return { req, sentBytes: () => sent };
}

describe("readMultipart without a Content-Length", () => {
  it("reads a small chunked upload", async () => {
    const { req } = chunkedMultipart(1000);
    expect(req.headers.get("content-length")).toBeNull();
    const form = await readMultipart(req, { maxBytes: 1024 * 1024, label: "logger file" });
    expect((form.get("file") as File).size).toBe(1000);
  });

  it("refuses a chunked upload over the limit as file_too_large, without reading it all", async () => {
    const { req, sentBytes } = chunkedMultipart(40 * 1024 * 1024);
    await expect(readMultipart(req, { maxBytes: 2 * 1024 * 1024, label: "logger file" })).rejects.toMatchObject({ code: "file_too_large", status: 413 });
    expect(sentBytes()).toBeLessThan(4 * 1024 * 1024);
  });
});
