import type { AttachmentDto } from '@femtoslot/shared';
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { DropZone } from '../../../components/ui/drop-zone';
import { uploadAttachment } from '../api/upload-attachment';

export interface AttachmentsFieldProps {
  bookingId: string;
  attachments: AttachmentDto[];
  onChange: (next: AttachmentDto[]) => void;
  readOnly: boolean;
}

const sizeFormat = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });
export const sizeText = (bytes: number) =>
  bytes < 1024 ? `${bytes} B` : bytes < 1024 * 1024 ? `${sizeFormat.format(bytes / 1024)} kB` : `${sizeFormat.format(bytes / 1024 / 1024)} MB`;

const MAX_BYTES = 10 * 1024 * 1024;

/** Other files for the log (spectra, photos of the table, reports); each is stored as soon as it is dropped. */
export function AttachmentsField({ bookingId, attachments, onChange, readOnly }: AttachmentsFieldProps) {
  const [busy, setBusy] = useState(0);
  const [problems, setProblems] = useState<string[]>([]);

  const onFiles = async (files: File[]) => {
    setProblems([]);
    const tooLarge = files.filter((f) => f.size > MAX_BYTES);
    const wanted = files.filter((f) => f.size <= MAX_BYTES);
    const found: string[] = tooLarge.map((f) => `${f.name}: larger than 10 MB`);
    setBusy((n) => n + wanted.length);
    const stored: AttachmentDto[] = [];
    await Promise.all(
      wanted.map(async (file) => {
        try {
          stored.push(await uploadAttachment({ bookingId, file }));
        } catch (error) {
          found.push(`${file.name}: ${error instanceof Error ? error.message : String(error)}`);
        } finally {
          setBusy((n) => n - 1);
        }
      }),
    );
    setProblems(found);
    if (stored.length > 0) onChange([...attachments, ...stored]);
  };

  return (
    <div className="space-y-2.5">
      {!readOnly && (
        <DropZone
          testId="attachments-drop"
          name="attachments"
          multiple
          accept=".csv,.txt,.pdf,.png,.jpg,.jpeg,text/csv,text/plain,application/pdf,image/png,image/jpeg"
          busy={busy > 0}
          onFiles={(files) => void onFiles(files)}
          label="Drop files here, or click to pick them"
          hint="CSV, TXT, PDF, PNG or JPEG, up to 10 MB each."
        />
      )}
      {problems.length > 0 && (
        <ul role="alert" data-testid="attachment-error" className="space-y-1 rounded-md bg-danger-soft px-3 py-2 text-sm font-semibold text-danger">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
      {attachments.length > 0 ? (
        <ul className="divide-y divide-line rounded-lg border border-line text-sm" data-testid="attachments-list">
          {attachments.map((a) => (
            <li key={a.id} className="flex items-center justify-between gap-3 px-3 py-2">
              <a href={a.url} download={a.originalName} data-testid="attachment-link" className="truncate font-semibold text-accent underline">
                {a.originalName}
              </a>
              <span className="ml-auto shrink-0 text-xs text-ink-muted">
                {a.contentType} · {sizeText(a.sizeBytes)}
              </span>
              {!readOnly && (
                <Button size="sm" variant="quiet" aria-label={`Remove ${a.originalName} from the log`} onClick={() => onChange(attachments.filter((x) => x.id !== a.id))}>
                  Remove
                </Button>
              )}
            </li>
          ))}
        </ul>
      ) : (
        readOnly && <p className="text-sm text-ink-muted">No attachments.</p>
      )}
    </div>
  );
}
