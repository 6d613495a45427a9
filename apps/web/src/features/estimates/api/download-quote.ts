import type { BookingEstimateInput } from '@femtoslot/shared';
import { useMutation } from '@tanstack/react-query';
import { ApiError } from '../../../lib/api-client';

/** The quote PDF for a request (POST /api/bookings/estimate.pdf), saved by the browser under the quote number. */
export async function downloadQuote(body: BookingEstimateInput): Promise<string> {
  const response = await fetch('/api/bookings/estimate.pdf', {
    method: 'POST', credentials: 'include', headers: { 'Content-Type': 'application/json', Accept: 'application/pdf' }, body: JSON.stringify(body),
  });
  if (!response.ok) {
    const data = (await response.json().catch(() => null)) as { error?: { code: string; message: string; details?: unknown } } | null;
    throw new ApiError(response.status, data?.error?.code ?? 'http_error', data?.error?.message ?? `The server answered ${response.status}`, data?.error?.details);
  }
  const name = /filename="?([^";]+)"?/.exec(response.headers.get('content-disposition') ?? '')?.[1] ?? 'femtoslot-quote.pdf';
  const url = URL.createObjectURL(await response.blob());
  const link = document.createElement('a');
  link.href = url;
  link.download = name;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
  return name;
}

export function useDownloadQuote() {
  return useMutation({ mutationFn: downloadQuote });
}
