import { useRef, useState } from 'react';
import { Download, FileText, Trash2, Upload } from 'lucide-react';
import type { StoredFile } from '@lotwise/shared';
import { Button, buttonClasses } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/dialog';
import { Notice } from '../../../components/ui/notice';
import { ProgressBar } from '../../../components/ui/progress-bar';
import { errorMessage } from '../../../lib/api-client';
import { formatDateTime } from '../../../lib/format';
import {
  formatFileSize,
  uploadErrorMessage,
  type UploadKind,
  type UploadProgress,
} from '../../../lib/upload';
import { useStoredFile } from '../api';

const accepts: Record<Exclude<UploadKind, 'csv'>, { input: string; words: string }> = {
  pdf: { input: 'application/pdf,.pdf', words: 'PDF only' },
  'pdf-or-image': {
    input: 'application/pdf,.pdf,image/png,.png,image/jpeg,.jpg,.jpeg',
    words: 'PDF, or a scan as PNG or JPEG',
  },
};

/**
 * One stored file (an SDS, a certificate of analysis): what it is, and upload, replace,
 * download and delete for those allowed to change it.
 */
export function StoredFilePanel({
  what,
  file,
  url,
  kind,
  canChange,
  missingText,
}: {
  /** e.g. "safety data sheet"; used in buttons and messages. */
  what: string;
  file: StoredFile | null | undefined;
  url: string;
  kind: Exclude<UploadKind, 'csv'>;
  canChange: boolean;
  /** Shown when there is no file yet. */
  missingText: string;
}) {
  const input = useRef<HTMLInputElement>(null);
  const { upload, remove } = useStoredFile(url);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  const accept = accepts[kind];

  function handleFile(chosen: File) {
    remove.reset();
    setProgress({ loaded: 0, total: chosen.size });
    upload.mutate(
      { file: chosen, onProgress: setProgress },
      { onSettled: () => setProgress(null) },
    );
  }

  return (
    <div className="flex flex-col gap-3">
      {file ? (
        <div className="flex flex-wrap items-start gap-3">
          <FileText aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-accent-700" />
          <div className="min-w-0 flex-1">
            <p className="font-medium break-all text-ink-900">{file.fileName}</p>
            <p className="text-xs text-ink-600 tabular-nums">
              {formatFileSize(file.size)} · uploaded {formatDateTime(file.uploadedAt)}
            </p>
          </div>
          <a href={url} download={file.fileName} className={buttonClasses('secondary', 'sm')}>
            <Download aria-hidden="true" className="size-4" />
            Download
          </a>
        </div>
      ) : (
        <p className="text-sm text-ink-700">{missingText}</p>
      )}

      {progress && (
        <ProgressBar
          label={`Uploading the ${what}`}
          value={progress.loaded}
          max={progress.total}
          detail={`${formatFileSize(progress.loaded)} of ${formatFileSize(progress.total)}`}
        />
      )}
      {upload.isError && (
        <Notice tone="danger" title={`The ${what} was not uploaded`}>
          {uploadErrorMessage(upload.error, kind)}
        </Notice>
      )}
      {upload.isSuccess && !progress && <Notice tone="ok">The {what} is saved.</Notice>}
      {remove.isError && (
        <Notice tone="danger" title={`The ${what} was not deleted`}>
          {errorMessage(remove.error)}
        </Notice>
      )}

      {canChange && (
        <div className="flex flex-wrap items-center gap-2">
          <input
            ref={input}
            type="file"
            accept={accept.input}
            className="sr-only"
            tabIndex={-1}
            aria-hidden="true"
            data-testid={`${kind}-file-input`}
            onChange={(event) => {
              const chosen = event.target.files?.[0];
              if (chosen) handleFile(chosen);
              event.target.value = '';
            }}
          />
          <Button
            size="sm"
            busy={upload.isPending}
            onClick={() => input.current?.click()}
            icon={<Upload aria-hidden="true" className="size-4" />}
          >
            {file ? `Replace ${what}` : `Upload ${what}`}
          </Button>
          {file && (
            <Button
              size="sm"
              variant="ghost"
              onClick={() => setConfirmDelete(true)}
              icon={<Trash2 aria-hidden="true" className="size-4" />}
            >
              Delete
            </Button>
          )}
          <span className="text-xs text-ink-600">
            {accept.words}; the type is read from the file itself.
          </span>
        </div>
      )}

      <ConfirmDialog
        open={confirmDelete}
        title={`Delete the ${what}?`}
        confirmLabel="Delete file"
        busy={remove.isPending}
        onCancel={() => setConfirmDelete(false)}
        onConfirm={() => {
          upload.reset();
          remove.mutate(undefined, { onSuccess: () => setConfirmDelete(false) });
        }}
        error={remove.isError && <Notice tone="danger">{errorMessage(remove.error)}</Notice>}
      >
        <p>
          {file?.fileName} is removed from Lotwise. Keep a copy if you may need it; you can upload a
          newer one at any time.
        </p>
      </ConfirmDialog>
    </div>
  );
}
