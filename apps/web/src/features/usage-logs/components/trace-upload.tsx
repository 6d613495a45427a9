import { type AttachmentDto, type AutocorrelationResult, type PulseShape, analyseAutocorrelation, assertPhysicalPulse, parseAutocorrelationCsv } from '@femtoslot/shared';
import { type ReactNode, Suspense, useEffect, useRef, useState } from 'react';
import { DropZone } from '../../../components/ui/drop-zone';
import { PartLoadBoundary, lazyPart } from '../../../components/ui/lazy-part';
import { Spinner } from '../../../components/ui/spinner';
import { type TraceAnalysis, analyseTrace } from '../api/analyse-trace';
import { uploadAttachment } from '../api/upload-attachment';

// The plot brings the charting library (over half of the session page's script) and is drawn only once a trace
// is dropped, so it loads then, alongside reading the file and the upload.
const loadTracePlot = () => import('./trace-plot');
const TracePlot = lazyPart(() => loadTracePlot().then((m) => m.TracePlot));

function PlotPlaceholder({ children }: { children: ReactNode }) {
  return (
    <div role="status" className="flex h-[17rem] items-center justify-center gap-2 rounded-lg border border-line bg-panel text-xs text-ink-muted">
      {children}
    </div>
  );
}

export interface TraceOutcome {
  pulseFwhmFs: number;
  traceAttachmentId: string;
  shape: PulseShape;
}

export interface TraceUploadProps {
  bookingId: string;
  shape: PulseShape;
  /** the segment's shortest wavelength (nm): no pulse there is shorter than one optical cycle */
  centreNm?: number;
  /** the spectral FWHM (nm), when known: no pulse is shorter than its transform limit */
  spectralFwhmNm?: number;
  colour: string;
  disabled?: boolean;
  /** the trace already on the saved log, if any */
  existing?: AttachmentDto;
  onResult: (outcome: TraceOutcome) => void;
}

type Local = { points: Array<[number, number]>; analysis: AutocorrelationResult };

const fs = new Intl.NumberFormat('en', { maximumFractionDigits: 1 });
const messageOf = (error: unknown) => (error instanceof Error ? error.message : String(error));

/** File.text() where the browser has it; FileReader otherwise (older engines, jsdom). */
function readText(file: File): Promise<string> {
  if (typeof file.text === 'function') return file.text();
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result ?? ''));
    reader.onerror = () => reject(reader.error ?? new Error('The file could not be read'));
    reader.readAsText(file);
  });
}

function readLocally(text: string, shape: PulseShape): Local {
  const { points } = parseAutocorrelationCsv(text);
  return { points, analysis: analyseAutocorrelation(points, shape) };
}

/** Why the API would refuse this pulse (below one optical cycle or the transform limit), or null. */
function implausible(local: Local, shape: PulseShape, centreNm?: number, spectralFwhmNm?: number): string | null {
  if (centreNm === undefined) return null;
  try {
    assertPhysicalPulse({ pulseFwhmFs: local.analysis.pulseFwhmFs, centreNm, spectralFwhmNm: spectralFwhmNm ?? null, shape });
    return null;
  } catch (cause) {
    return messageOf(cause);
  }
}

/**
 * An autocorrelation trace for one segment: read here to draw it, stored as an attachment, and analysed by the
 * API, whose pulse FWHM is the value the log keeps.
 */
export function TraceUpload({ bookingId, shape, centreNm, spectralFwhmNm, colour, disabled, existing, onResult }: TraceUploadProps) {
  const [file, setFile] = useState<File | null>(null);
  const [text, setText] = useState<string | null>(null);
  const [local, setLocal] = useState<Local | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [attachment, setAttachment] = useState<AttachmentDto | null>(existing ?? null);
  const [server, setServer] = useState<TraceAnalysis | null>(null);
  const [busy, setBusy] = useState(false);
  const run = useRef(0);
  const onResultRef = useRef(onResult);
  onResultRef.current = onResult;

  const analyseOnServer = async (picked: File, pickedShape: PulseShape, upload: Promise<AttachmentDto> | AttachmentDto) => {
    const ticket = ++run.current;
    setBusy(true);
    setServer(null);
    try {
      const [stored, result] = await Promise.all([upload, analyseTrace({ file: picked, shape: pickedShape, centreNm, spectralFwhmNm })]);
      if (ticket !== run.current) return;
      setAttachment(stored);
      setServer(result);
      onResultRef.current({ pulseFwhmFs: Math.round(result.pulseFwhmFs * 10) / 10, traceAttachmentId: stored.id, shape: result.shape });
    } catch (cause) {
      if (ticket === run.current) setError(messageOf(cause));
    } finally {
      if (ticket === run.current) setBusy(false);
    }
  };

  const onFiles = async ([picked]: File[]) => {
    if (!picked) return;
    loadTracePlot().catch(() => undefined);
    run.current += 1;
    setFile(picked);
    setServer(null);
    setError(null);
    setLocal(null);
    const content = await readText(picked);
    setText(content);
    let read: Local;
    try {
      read = readLocally(content, shape);
    } catch (cause) {
      // the API runs the same engine: a file that fails here would fail there, so it is not stored
      setError(messageOf(cause));
      return;
    }
    // drawn either way (fringes show why), stored only when the pulse is physical
    setLocal(read);
    const problem = implausible(read, shape, centreNm, spectralFwhmNm);
    if (problem) return setError(problem);
    void analyseOnServer(picked, shape, uploadAttachment({ bookingId, file: picked }));
  };

  // a new shape changes the deconvolution factor: draw and ask again, without storing the file twice
  const lastShape = useRef(shape);
  useEffect(() => {
    if (lastShape.current === shape) return;
    lastShape.current = shape;
    if (!file || text === null || !local) return;
    setError(null);
    let read: Local;
    try {
      read = readLocally(text, shape);
    } catch (cause) {
      setError(messageOf(cause));
      return;
    }
    setLocal(read);
    const problem = implausible(read, shape, centreNm, spectralFwhmNm);
    if (problem) return setError(problem);
    void analyseOnServer(file, shape, attachment ?? uploadAttachment({ bookingId, file }));
  }, [shape]);

  return (
    <div className="space-y-2.5">
      {!disabled && (<DropZone
        testId="trace-drop"
        name="trace"
        accept=".csv,.txt,text/csv,text/plain"
        disabled={disabled}
        busy={busy}
        onFiles={(files) => void onFiles(files)}
        label={file ? `Replace the trace (${file.name})` : 'Drop an autocorrelation trace here, or click to pick one'}
        hint="CSV or TXT, two columns: delay (fs) and signal; a header line is optional."
      />)}
      {!file && existing && (
        <p className="text-xs text-ink-muted">
          Trace on file:{' '}
          <a href={existing.url} download={existing.originalName} data-testid="trace-link" className="font-semibold text-accent underline">
            {existing.originalName}
          </a>
        </p>
      )}
      {error && (
        <p role="alert" data-testid="trace-error" className="rounded-md bg-danger-soft px-3 py-2 text-sm font-semibold text-danger">
          {error}
        </p>
      )}
      {local && (
        <PartLoadBoundary failed={<PlotPlaceholder>The plot could not be loaded; the pulse duration below still applies.</PlotPlaceholder>}>
          <Suspense fallback={<PlotPlaceholder><Spinner /> Drawing the trace…</PlotPlaceholder>}>
            <TracePlot points={local.points} analysis={local.analysis} colour={colour} />
          </Suspense>
        </PartLoadBoundary>
      )}
      {busy && (
        <p className="flex items-center gap-2 text-xs text-ink-muted" role="status">
          <Spinner /> Storing the trace and computing the pulse duration…
        </p>
      )}
      {server && (
        <p data-testid="trace-result" data-pulse-fs={server.pulseFwhmFs} className="rounded-md bg-success-soft px-3 py-2 text-sm" role="status">
          <span className="font-semibold">Pulse FWHM {fs.format(server.pulseFwhmFs)} fs</span> from an autocorrelation FWHM of{' '}
          {fs.format(server.acFwhmFs)} fs, assuming a {server.shape === 'sech2' ? 'sech²' : 'Gaussian'} pulse. Filled in above
          {attachment ? `; the trace is kept as ${attachment.originalName}` : ''}.
        </p>
      )}
    </div>
  );
}
