// Drag-and-drop (or pick) a model file; the server reads it fully first and answers a preview, so a refused file
// shows its parse errors here, and a readable one is stored only when the person confirms what it holds.
import { useRef, useState } from "react";
import { MODEL_UPLOAD_LIMIT_BYTES, type ModelDetail } from "@shared/schemas/models";
import { usePreviewUpload, useUploadModel } from "../api/upload-model";
import { issuesOf, ParseErrorList } from "./parse-error-list";
import { UploadPreviewPanel } from "./upload-preview-panel";

const accepted = ".sbml,.xml,.rules,.txt,.csv";

export function UploadDropZone({
  projectId,
  onUploaded,
}: {
  projectId: string;
  onUploaded(detail: ModelDetail): void;
}) {
  const upload = useUploadModel(projectId);
  const preview = usePreviewUpload(projectId);
  const [file, setFile] = useState<File | null>(null);
  const input = useRef<HTMLInputElement>(null);
  const [isOver, setOver] = useState(false);
  const [localError, setLocalError] = useState<string | null>(null);
  const [fileName, setFileName] = useState<string | null>(null);

  const send = (file: File | undefined) => {
    if (!file) return;
    setFileName(file.name);
    if (file.size > MODEL_UPLOAD_LIMIT_BYTES) {
      setLocalError(`${file.name} is ${(file.size / 1048576).toFixed(1)} MB; model files may be at most 5 MB.`);
      return;
    }
    setLocalError(null);
    upload.reset();
    setFile(file);
    preview.mutate(file);
  };
  const failure = preview.error ?? upload.error;
  const issues = issuesOf(failure);

  return (
    <div className="space-y-3">
      <div
        data-testid="upload-drop-zone"
        role="button"
        tabIndex={0}
        onClick={() => input.current?.click()}
        onKeyDown={(e) => (e.key === "Enter" || e.key === " ") && input.current?.click()}
        onDragOver={(e) => {
          e.preventDefault();
          setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={(e) => {
          e.preventDefault();
          setOver(false);
          send(e.dataTransfer.files[0]);
        }}
        className={`flex cursor-pointer flex-col items-center justify-center rounded-lg border-2 border-dashed px-6 py-10 text-center ${isOver ? "border-brand-600 bg-brand-50" : "border-slate-300 bg-white hover:border-brand-600"}`}
      >
        <p className="text-sm font-medium text-slate-800">Drop a model file here, or click to choose one</p>
        <p className="mt-1 text-xs text-slate-500">
          SBML-qual (.sbml, .xml), rule text (.rules, .txt) or truth tables (.csv), up to 5 MB
        </p>
        {preview.isPending && <p className="mt-2 text-xs text-brand-700">Reading {fileName}…</p>}
        <input
          ref={input}
          type="file"
          accept={accepted}
          data-testid="upload-input"
          className="hidden"
          onChange={(e) => {
            send(e.target.files?.[0]);
            e.target.value = "";
          }}
        />
      </div>
      {localError && (
        <p role="alert" className="text-sm text-red-700">
          {localError}
        </p>
      )}
      {issues.length > 0 && (
        <ParseErrorList errors={issues} title={`${fileName} could not be read; nothing was stored`} />
      )}
      {failure && issues.length === 0 && (
        <p role="alert" className="text-sm text-red-700">
          {failure.message}
        </p>
      )}
      {preview.data && file && !preview.isPending && (
        <UploadPreviewPanel
          key={preview.data.fileName + file.lastModified}
          projectId={projectId}
          preview={preview.data}
          isStoring={upload.isPending}
          onStore={(name) => upload.mutate({ file, name }, { onSuccess: onUploaded })}
          onCancel={() => {
            preview.reset();
            setFile(null);
          }}
          onRevised={onUploaded}
        />
      )}
    </div>
  );
}
