/**
 * Posts the file with XMLHttpRequest rather than fetch: only XHR reports upload progress, and
 * its responseText grows while the server streams progress lines, so one request shows all
 * four phases (upload, read, check rows, write months).
 */
export type Phase = "upload" | "parse" | "validate" | "commit";
export interface Progress {
  phase: Phase;
  done: number;
  total: number;
}
export interface ApiError {
  code: string;
  message: string;
  issues?: { path: string; message: string }[];
}
export type Outcome<T> = { ok: true; body: T } | { ok: false; status: number; error: ApiError };

export function sendImport<T>(url: string, form: FormData, onProgress: (p: Progress) => void): Promise<Outcome<T>> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    let seen = 0;
    let result: { status: number; body: unknown } | null = null;
    const streamed = () => (xhr.getResponseHeader("content-type") ?? "").startsWith("application/x-ndjson");
    const readLines = () => {
      if (!streamed()) return;
      const text = xhr.responseText;
      const end = text.lastIndexOf("\n");
      if (end < seen) return;
      for (const line of text.slice(seen, end).split("\n")) {
        if (!line.trim()) continue;
        const e = JSON.parse(line);
        if (e.type === "progress") onProgress({ phase: e.phase, done: e.done, total: e.total });
        else if (e.type === "result") result = { status: e.status, body: e.body };
      }
      seen = end + 1;
    };
    const finish = (status: number, body: unknown) => {
      if (status >= 200 && status < 300) resolve({ ok: true, body: body as T });
      else {
        const error = (body as { error?: ApiError } | null)?.error ?? { code: "unknown", message: `The server answered ${status}.` };
        resolve({ ok: false, status, error });
      }
    };
    xhr.open("POST", url);
    xhr.setRequestHeader("accept", "application/x-ndjson");
    xhr.upload.onprogress = (e) => onProgress({ phase: "upload", done: e.loaded, total: e.lengthComputable ? e.total : e.loaded });
    xhr.onprogress = readLines;
    xhr.onload = () => {
      readLines();
      if (result) return finish(result.status, result.body);
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        // A proxy's HTML error page, for instance: reported by status below.
      }
      finish(xhr.status, body);
    };
    xhr.onerror = () => resolve({ ok: false, status: 0, error: { code: "network", message: "The connection to the server was lost. Nothing is imported until the last step reports success." } });
    xhr.send(form);
  });
}
