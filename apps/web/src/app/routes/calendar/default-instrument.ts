/** The calendar opens on the source, not a bench; with no source, on the first instrument. */
export function defaultInstrumentId(instruments: { id: string; kind: string }[]): string {
  return instruments.find((i) => i.kind === 'source')?.id ?? instruments[0]?.id ?? '';
}
