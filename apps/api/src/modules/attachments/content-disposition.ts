import { create } from 'content-disposition';

/**
 * A readable US-ASCII stand-in for a file name: accents dropped (NFKD, combining marks removed), anything else
 * outside printable ASCII replaced by "_".
 */
export function asciiFallback(name: string): string {
  return name.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').replace(/[^\x20-\x7e]/g, '_');
}

/**
 * `Content-Disposition: attachment` for a download (RFC 6266): the name in `filename*` as UTF-8 percent-encoding
 * (RFC 5987 / RFC 8187) after a US-ASCII `filename=` for clients that do not read the extended form (RFC 6266 §4.3).
 */
export function attachmentDisposition(name: string): string {
  return create(name, { type: 'attachment', fallback: asciiFallback(name) });
}
