import type { AttachmentDto } from '@femtoslot/shared';
import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';

export interface UploadAttachmentVariables {
  bookingId: string;
  file: File;
}

/** CSV, TXT, PDF, PNG or JPEG up to 10 MB; the server decides the type by content (413 / 415 otherwise). */
export const uploadAttachment = ({ bookingId, file }: UploadAttachmentVariables) => {
  const form = new FormData();
  form.append('file', file, file.name);
  return apiClient
    .postForm<{ attachment: AttachmentDto }>(`/api/bookings/${encodeURIComponent(bookingId)}/attachments`, form)
    .then((body) => body.attachment);
};

// Nothing to invalidate: an attachment joins the log only when the log is saved.
export function useUploadAttachment() {
  return useMutation({ mutationFn: uploadAttachment });
}
