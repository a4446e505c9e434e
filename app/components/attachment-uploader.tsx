import { useEffect, useId, useRef, useState } from "react";
import { useRevalidator } from "react-router";
import type { AttachmentLimits, AttachmentView, FileProblem } from "~/services/attachments.server";
import { ACCEPTED_EXTENSIONS, ACCEPTED_KINDS_TEXT, ACCEPT_ATTRIBUTE, extensionOf } from "~/services/file-types";
import { Button, Notice } from "./ui";

// Drawings and photos of a draft spec. Without JavaScript it is two plain multipart forms that
// post and come back; with JavaScript each chosen file is sent on its own XMLHttpRequest, so it
// gets its own progress bar and its own answer. The server checks everything again.

interface Props {
  specId: string;
  attachments: AttachmentView[];
  limits: AttachmentLimits;
}

interface Pending {
  key: number;
  fileName: string;
  loaded: number;
  total: number;
}

interface Answer {
  attachments: AttachmentView[];
  errors: FileProblem[];
  summary: string;
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
  const mb = bytes / (1024 * 1024);
  return `${mb < 10 ? mb.toFixed(1) : Math.round(mb)} MB`;
}

const NO_ANSWER = "The server did not answer. Check your connection (or sign in again) and try once more.";

/** Posts a form asking for JSON; resolves with null when no JSON answer came back. */
function send(url: string, form: FormData, onProgress?: (loaded: number, total: number) => void): Promise<Answer | null> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.setRequestHeader("Accept", "application/json");
    xhr.responseType = "json";
    if (onProgress) xhr.upload.onprogress = (e) => e.lengthComputable && onProgress(e.loaded, e.total);
    xhr.onload = () => resolve(xhr.response && Array.isArray(xhr.response.errors) ? (xhr.response as Answer) : null);
    xhr.onerror = () => resolve(null);
    xhr.send(form);
  });
}

/** What the browser can tell before sending: the name and the size. */
function precheck(file: File, limits: AttachmentLimits): string | null {
  if (!ACCEPTED_EXTENSIONS.includes(extensionOf(file.name))) return `Only ${ACCEPTED_KINDS_TEXT} files can be attached.`;
  if (file.size === 0) return "This file is empty (0 bytes).";
  if (file.size > limits.maxFileBytes) return `This file is ${formatBytes(file.size)}; each file may be at most ${formatBytes(limits.maxFileBytes)}.`;
  return null;
}

export function AttachmentUploader({ specId, attachments, limits }: Props) {
  const url = `/specs/${specId}/attachments`;
  const inputId = useId();
  const hintId = useId();
  const input = useRef<HTMLInputElement>(null);
  const revalidator = useRevalidator();
  const [enhanced, setEnhanced] = useState(false);
  const [files, setFiles] = useState(attachments);
  const [pending, setPending] = useState<Pending[]>([]);
  const [problems, setProblems] = useState<FileProblem[]>([]);
  const [status, setStatus] = useState("");
  const busy = pending.length > 0;
  const full = files.length >= limits.maxFilesPerSpec;

  useEffect(() => setEnhanced(true), []);
  useEffect(() => setFiles(attachments), [attachments]);

  async function upload(chosen: File[]) {
    const found: FileProblem[] = [];
    let room = limits.maxFilesPerSpec - files.length;
    const sendable = chosen.filter((file) => {
      const reason = precheck(file, limits) ?? (room <= 0 ? `Not attached: a spec holds at most ${limits.maxFilesPerSpec} files.` : null);
      if (reason) found.push({ fileName: file.name, message: reason });
      else room -= 1;
      return !reason;
    });
    const queue = sendable.map((file, i) => ({ key: Date.now() + i, fileName: file.name, loaded: 0, total: file.size }));
    setProblems(found);
    setPending(queue);
    let attached = 0;
    for (const [i, file] of sendable.entries()) {
      const { key } = queue[i];
      setStatus(`Uploading ${file.name} (${i + 1} of ${sendable.length})…`);
      const form = new FormData();
      form.set("intent", "upload");
      form.append("files", file);
      const answer = await send(url, form, (loaded, total) => setPending((list) => list.map((p) => (p.key === key ? { ...p, loaded, total } : p))));
      setPending((list) => list.filter((p) => p.key !== key));
      if (!answer) found.push({ fileName: file.name, message: NO_ANSWER });
      else {
        setFiles(answer.attachments);
        // One file per request, so an unnamed refusal is about this file.
        found.push(...answer.errors.map((e) => ({ fileName: e.fileName ?? file.name, message: e.message })));
        if (answer.errors.length === 0) attached += 1;
      }
      setProblems([...found]);
    }
    const refused = found.length ? ` ${found.length === 1 ? "One file was" : `${found.length} files were`} not attached.` : "";
    const done = attached === 0 ? "Nothing was attached." : attached === 1 ? "1 file attached." : `${attached} files attached.`;
    setStatus(`${done}${attached > 0 ? refused : ""}`);
    if (attached > 0) revalidator.revalidate();
  }

  async function remove(attachment: AttachmentView) {
    const form = new FormData();
    form.set("intent", "remove");
    form.set("attachmentId", attachment.id);
    setStatus(`Removing ${attachment.fileName}…`);
    const answer = await send(url, form);
    if (!answer) {
      setProblems([{ fileName: attachment.fileName, message: NO_ANSWER }]);
      setStatus("");
      return;
    }
    setFiles(answer.attachments);
    setProblems(answer.errors);
    setStatus(answer.summary);
    if (answer.errors.length === 0) revalidator.revalidate();
  }

  return (
    // data-enhanced: files chosen from now on upload at once (before, the plain form waits for its button).
    <div className="space-y-4" data-enhanced={enhanced || undefined}>
      <form
        method="post"
        action={url}
        encType="multipart/form-data"
        onSubmit={(e) => {
          e.preventDefault();
          const chosen = Array.from(input.current?.files ?? []);
          if (chosen.length) void upload(chosen);
        }}
      >
        <input type="hidden" name="intent" value="upload" />
        <label htmlFor={inputId} className="block text-sm font-semibold text-ink-800">
          Drawings and photos
        </label>
        <p id={hintId} className="mt-1 text-sm text-ink-600">
          {ACCEPTED_KINDS_TEXT}, up to {formatBytes(limits.maxFileBytes)} each and {limits.maxFilesPerSpec} per spec. For example a layout drawing of the
          machine or a photo of where the cylinder mounts. Shops see them once you publish.
        </p>
        <div className="mt-2 flex flex-wrap items-center gap-3">
          <input
            ref={input}
            id={inputId}
            type="file"
            name="files"
            multiple
            accept={ACCEPT_ATTRIBUTE}
            aria-describedby={hintId}
            disabled={busy || full}
            onChange={(e) => {
              const chosen = Array.from(e.currentTarget.files ?? []);
              // Reset so choosing the same file again after a refusal still fires a change.
              e.currentTarget.value = "";
              if (chosen.length) void upload(chosen);
            }}
            className="block text-sm text-ink-800 file:mr-3 file:rounded-md file:border-0 file:bg-flow-50 file:px-4 file:py-2 file:text-sm file:font-semibold file:text-flow-700 hover:file:bg-flow-100 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-flow-600 disabled:opacity-60"
          />
          {/* With JavaScript files go up as soon as they are chosen; this button is the form's way without it. */}
          {enhanced ? null : (
            <Button type="submit" tone="secondary">
              Upload
            </Button>
          )}
        </div>
        {full ? <p className="mt-2 text-sm text-signal-700">This spec holds the most files it can. Remove one to add another.</p> : null}
      </form>

      <p role="status" aria-live="polite" className="text-sm text-ink-600">
        {status}
      </p>

      {pending.length ? (
        <ul className="space-y-2" aria-label="Files being uploaded">
          {pending.map((p) => {
            const percent = p.total ? Math.round((p.loaded / p.total) * 100) : 0;
            const barId = `upload-${p.key}`;
            return (
              <li key={p.key} className="text-sm">
                <label htmlFor={barId} className="flex justify-between text-ink-800">
                  <span className="truncate">{p.fileName}</span>
                  <span className="tabular-nums text-ink-600">{percent}%</span>
                </label>
                <progress
                  id={barId}
                  max={100}
                  value={percent}
                  className="mt-1 h-2 w-full overflow-hidden rounded-full bg-ink-100 [&::-moz-progress-bar]:bg-flow-600 [&::-webkit-progress-bar]:bg-ink-100 [&::-webkit-progress-value]:bg-flow-600"
                >
                  {percent}%
                </progress>
              </li>
            );
          })}
        </ul>
      ) : null}

      {problems.length ? (
        <Notice tone="bad">
          <ul className="space-y-1">
            {problems.map((p, i) => (
              <li key={i}>
                {p.fileName ? <span className="font-semibold">{p.fileName}: </span> : null}
                {p.message}
              </li>
            ))}
          </ul>
        </Notice>
      ) : null}

      {files.length ? (
        <ul className="divide-y divide-ink-100 rounded-md ring-1 ring-ink-100" aria-label="Attached files">
          {files.map((file) => (
            <li key={file.id} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3 text-sm">
              <div className="min-w-0">
                <a href={file.downloadUrl} className="block truncate font-semibold text-flow-700 hover:underline" download>
                  {file.fileName}
                </a>
                <span className="text-ink-600">
                  {file.kindLabel} · {formatBytes(file.sizeBytes)}
                </span>
              </div>
              <form
                method="post"
                action={url}
                encType="multipart/form-data"
                onSubmit={(e) => {
                  e.preventDefault();
                  void remove(file);
                }}
              >
                <input type="hidden" name="intent" value="remove" />
                <input type="hidden" name="attachmentId" value={file.id} />
                <Button type="submit" tone="danger" disabled={busy} aria-label={`Remove ${file.fileName}`}>
                  Remove
                </Button>
              </form>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-ink-600">No files attached yet.</p>
      )}
    </div>
  );
}
