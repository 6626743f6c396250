/** A multipart POST with upload progress (fetch cannot report it); resolves with status and JSON body. */
export function postForm(url: string, form: FormData, onProgress?: (fraction: number) => void): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.responseType = "text";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && onProgress) onProgress(e.loaded / e.total);
    };
    xhr.upload.onload = () => onProgress?.(1);
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = { error: { code: "internal", message: "The server's answer could not be read. Try again." } };
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => resolve({ status: 0, body: { error: { code: "network", message: "The upload did not reach the server. Check the connection and try again." } } });
    xhr.send(form);
  });
}

export type ApiErrorBody = { error: { code: string; message: string; details?: Record<string, unknown> | null } };

export function errorOf(body: unknown): ApiErrorBody["error"] {
  const e = (body as ApiErrorBody | null)?.error;
  return e ?? { code: "internal", message: "Something went wrong." };
}

/** "Z1=120, Z2=150" or "120 150 165" → JSON for setPoints; null when blank; an error sentence when unreadable. */
export function parseSetPoints(text: string): { json: string | null; error: string | null } {
  const t = text.trim();
  if (!t) return { json: null, error: null };
  const parts = t.split(/[,;\s]+/).filter(Boolean);
  if (parts.every((p) => /^-?\d+([.,]\d+)?$/.test(p))) return { json: JSON.stringify(parts.map((p) => Number(p.replace(",", ".")))), error: null };
  const out: Record<string, number> = {};
  for (const p of t.split(/[,;]+/).map((s) => s.trim()).filter(Boolean)) {
    const m = /^([\w -]{1,40}?)\s*[=:]\s*(-?\d+(?:[.,]\d+)?)$/.exec(p);
    if (!m) return { json: null, error: `"${p}" is not a zone and temperature; write them like Z1=120, Z2=150.` };
    out[m[1].trim()] = Number(m[2].replace(",", "."));
  }
  return { json: JSON.stringify(out), error: null };
}
