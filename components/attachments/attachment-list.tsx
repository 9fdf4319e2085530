"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useId, useRef, useState } from "react";
import { FieldError } from "@/components/ui/field-error";
import { formatDateTime } from "@/reports/format";
import { Notice } from "@/components/ui/status";
import { buttonDanger, buttonPrimary, input, label, link } from "@/components/ui/styles";
import { ATTACHMENT_CATEGORIES, CATEGORY_LABELS, MAX_ATTACHMENT_BYTES, type AttachmentCategory } from "@/lib/attachments/categories";
import type { PublicAttachment } from "@/lib/attachments/service";
import { formatBytes } from "@/lib/import/limits";

type Row = Omit<PublicAttachment, "createdAt"> & { createdAt: string };

async function json<T>(res: Response): Promise<T> {
  const body = res.status === 204 ? null : await res.json().catch(() => null);
  if (!res.ok) throw new Error(body?.error?.message ?? `The server answered ${res.status}.`);
  return body as T;
}

const TYPE_WORDS: Record<string, string> = { "application/pdf": "PDF", "image/png": "PNG", "image/jpeg": "JPEG", "text/csv": "CSV" };

/**
 * Certificates and invoices of one site-month, for the month page. Everyone in the organisation
 * can download; `canUpload` shows the upload form (the server decides again); the delete button
 * appears where the server says this user may delete.
 */
export function AttachmentList({ siteId, month, canUpload }: { siteId: string; month: string; canUpload: boolean }) {
  const id = useId();
  const qc = useQueryClient();
  const key = ["attachments", siteId, month];
  const url = `/api/v1/sites/${siteId}/months/${month}/attachments`;
  const list = useQuery({ queryKey: key, queryFn: async () => (await json<{ attachments: Row[] }>(await fetch(url))).attachments });
  const fileRef = useRef<HTMLInputElement>(null);
  const [category, setCategory] = useState<AttachmentCategory>("lab-certificate");
  const [fileError, setFileError] = useState<string | undefined>();

  const upload = useMutation({
    mutationFn: async (file: File) => {
      const form = new FormData();
      form.set("file", file);
      form.set("category", category);
      return json<{ attachment: Row }>(await fetch(url, { method: "POST", body: form }));
    },
    onSuccess: () => {
      if (fileRef.current) fileRef.current.value = "";
      void qc.invalidateQueries({ queryKey: key });
    },
    onError: (err) => setFileError(err.message),
  });
  const remove = useMutation({
    mutationFn: async (a: Row) => json(await fetch(a.href, { method: "DELETE" })),
    onSuccess: () => void qc.invalidateQueries({ queryKey: key }),
  });

  return (
    <section aria-labelledby={`${id}-h`} className="space-y-3">
      <h2 id={`${id}-h`} className="text-base font-semibold">
        Evidence attached to this month
      </h2>
      {list.isError ? <Notice tone="fault" title="The attachments could not be loaded">{list.error.message}</Notice> : null}
      {remove.isError ? <Notice tone="fault" title="Not deleted">{remove.error.message}</Notice> : null}
      {list.isPending ? (
        <p className="text-sm text-ink-soft">Loading…</p>
      ) : list.data?.length ? (
        <table className="w-full border border-rule bg-white text-sm">
          <thead className="bg-paper-deep text-left text-xs text-ink-soft">
            <tr>
              <th scope="col" className="px-3 py-1 font-medium">File</th>
              <th scope="col" className="px-3 py-1 font-medium">What</th>
              <th scope="col" className="px-3 py-1 text-right font-medium">Size</th>
              <th scope="col" className="px-3 py-1 font-medium">Attached</th>
              <th scope="col" className="px-3 py-1"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {list.data.map((a) => (
              <tr key={a.id} className="border-t border-rule align-top">
                <td className="px-3 py-1.5">
                  <a className={link} href={a.href} download>
                    {a.fileName}
                  </a>{" "}
                  <span className="text-xs text-ink-faint">{TYPE_WORDS[a.mediaType] ?? a.mediaType}</span>
                  <div className="num text-xs text-ink-faint" title="SHA-256 of the stored file">
                    sha256 {a.sha256.slice(0, 16)}…
                  </div>
                </td>
                <td className="px-3 py-1.5">
                  {CATEGORY_LABELS[a.category as AttachmentCategory] ?? a.category}
                  {a.stream ? <span className="num text-xs text-ink-faint"> · {a.stream}</span> : null}
                </td>
                <td className="num px-3 py-1.5 text-right">{formatBytes(a.sizeBytes)}</td>
                <td className="px-3 py-1.5">
                  {a.uploadedBy ?? "—"}
                  <div className="num text-xs text-ink-faint">{formatDateTime(new Date(a.createdAt))}</div>
                </td>
                <td className="px-3 py-1.5 text-right">
                  {a.canDelete ? (
                    <button
                      type="button"
                      className={buttonDanger}
                      disabled={remove.isPending}
                      onClick={() => {
                        if (window.confirm(`Delete ${a.fileName}? The audit trail keeps a record that it existed.`)) remove.mutate(a);
                      }}
                    >
                      Delete<span className="sr-only"> {a.fileName}</span>
                    </button>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : (
        <p className="text-sm text-ink-soft">No certificates or invoices attached yet.</p>
      )}

      {canUpload ? (
        <form
          className="flex flex-wrap items-end gap-3 border border-dashed border-rule-strong px-3 py-3"
          onSubmit={(e) => {
            e.preventDefault();
            const file = fileRef.current?.files?.[0];
            setFileError(undefined);
            if (!file) return setFileError("Choose a file first.");
            if (file.size > MAX_ATTACHMENT_BYTES) return setFileError(`"${file.name}" is ${formatBytes(file.size)}; the limit is ${formatBytes(MAX_ATTACHMENT_BYTES)}.`);
            upload.mutate(file);
          }}
        >
          <div className="min-w-64 flex-1">
            <label htmlFor={`${id}-file`} className={label}>
              File (PDF, PNG, JPEG or CSV, up to {formatBytes(MAX_ATTACHMENT_BYTES)})
            </label>
            <input
              id={`${id}-file`}
              ref={fileRef}
              type="file"
              accept=".pdf,.png,.jpg,.jpeg,.csv"
              aria-invalid={!!fileError}
              aria-describedby={fileError ? `${id}-err` : undefined}
              className="mt-1 block w-full text-sm file:mr-3 file:border file:border-rule-strong file:bg-paper-deep file:px-3 file:py-1 file:text-sm"
            />
            <FieldError id={`${id}-err`} message={fileError} />
          </div>
          <div>
            <label htmlFor={`${id}-cat`} className={label}>
              What it is
            </label>
            <select id={`${id}-cat`} className={`${input} mt-1`} value={category} onChange={(e) => setCategory(e.target.value as AttachmentCategory)}>
              {ATTACHMENT_CATEGORIES.map((c) => (
                <option key={c} value={c}>
                  {CATEGORY_LABELS[c]}
                </option>
              ))}
            </select>
          </div>
          <button type="submit" className={buttonPrimary} disabled={upload.isPending}>
            {upload.isPending ? "Attaching…" : "Attach"}
          </button>
        </form>
      ) : null}
    </section>
  );
}
