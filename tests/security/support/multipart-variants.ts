/**
 * Multipart bodies for the upload routes (RFC 7578 multipart/form-data, RFC 2046 §5.1.1 boundaries). `malformed` ones
 * break the framing and must be refused with 400 whichever field the route reads; the rest are well formed but odd,
 * and may be refused for what they carry (any 4xx).
 */
export interface MultipartVariant { name: string; type: string; body: Buffer; malformed: boolean }

const CRLF = '\r\n';
const part = (boundary: string, disposition: string, content: string, type = 'text/csv') =>
  `--${boundary}${CRLF}Content-Disposition: ${disposition}${CRLF}Content-Type: ${type}${CRLF}${CRLF}${content}${CRLF}`;
const close = (boundary: string) => `--${boundary}--${CRLF}`;
const csv = 'delay_fs,signal\n-100,0.1\n0,1\n100,0.1\n';

export function multipartVariants(): MultipartVariant[] {
  const b = 'femtoslotBoundary7MA4YWxkTrZu0gW';
  const whole = (fieldName: string, filename: string) => part(b, `form-data; name="${fieldName}"; filename="${filename}"`, csv) + close(b);
  const ok = whole('file', 'trace.csv');
  const v = (name: string, type: string, body: string | Buffer, malformed: boolean): MultipartVariant =>
    ({ name, type, body: typeof body === 'string' ? Buffer.from(body, 'utf8') : body, malformed });
  return [
    v('no boundary parameter', 'multipart/form-data', ok, true),
    // An empty boundary makes the Content-Type unparseable, so it is not taken for multipart at all (any 4xx).
    v('empty boundary parameter', 'multipart/form-data; boundary=', ok, false),
    v('boundary that the body does not use', 'multipart/form-data; boundary=SomethingElseEntirely', ok, true),
    v('truncated in the middle of the file', `multipart/form-data; boundary=${b}`, ok.slice(0, ok.indexOf('0,1')), true),
    v('truncated before the closing boundary', `multipart/form-data; boundary=${b}`, ok.slice(0, ok.lastIndexOf(`--${b}--`)), true),
    v('100,000-character file name', `multipart/form-data; boundary=${b}`, whole('file', `${'a'.repeat(100_000)}.csv`), true),
    v('part headers that never end', `multipart/form-data; boundary=${b}`, `--${b}${CRLF}Content-Disposition: form-data; name="file"${CRLF}X: ${'y'.repeat(20_000)}`, true),
    v('2,000-character field name', `multipart/form-data; boundary=${b}`, part(b, `form-data; name="${'f'.repeat(2000)}"`, 'x', 'text/plain') + close(b), false),
    v('a second file where one is allowed', `multipart/form-data; boundary=${b}`, part(b, 'form-data; name="file"; filename="a.csv"', csv) + part(b, 'form-data; name="file"; filename="b.csv"', csv) + close(b), true),
    v('NUL byte in the file name', `multipart/form-data; boundary=${b}`, whole('file', 'tra\u0000ce.csv'), false),
    v('NUL in an RFC 5987 file name', `multipart/form-data; boundary=${b}`, part(b, "form-data; name=\"file\"; filename*=UTF-8''tra%00ce.csv", csv) + close(b), false),
    v('path in the file name', `multipart/form-data; boundary=${b}`, whole('file', '../../etc/cron.d/x.csv'), false),
    v('no parts at all', `multipart/form-data; boundary=${b}`, close(b), false),
    v('a part without Content-Disposition', `multipart/form-data; boundary=${b}`, `--${b}${CRLF}Content-Type: text/plain${CRLF}${CRLF}hello${CRLF}${close(b)}`, false),
    v('invalid UTF-8 bytes in the file name', `multipart/form-data; boundary=${b}`, Buffer.concat([Buffer.from(`--${b}${CRLF}Content-Disposition: form-data; name="file"; filename="`), Buffer.from([0xed, 0xa0, 0x80, 0xff]), Buffer.from(`.csv"${CRLF}Content-Type: text/csv${CRLF}${CRLF}${csv}${CRLF}${close(b)}`)]), false),
  ];
}
