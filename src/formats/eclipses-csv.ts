// Eclipses as CSV per RFC 4180: a header row naming each column with its unit, one record per
// eclipse (the Earth's and the Moon's together, in time order of their start), CRLF after every
// record, no quoting needed. Empty fields where the answer has null (no umbra).

export const ECLIPSES_CSV_HEADER =
  'start_utc,stop_utc,umbra_start_utc,umbra_stop_utc,duration_s,umbra_duration_s,depth,occulter,starts_before_window,ends_after_window';

export interface EclipseRow {
  readonly start: string;
  readonly stop: string;
  readonly umbraStart: string | null;
  readonly umbraStop: string | null;
  readonly duration: number;
  readonly umbraDuration: number | null;
  readonly depth: number;
  readonly startsBeforeWindow: boolean;
  readonly endsAfterWindow: boolean;
}

const CRLF = '\r\n';

/** The CSV text of the Earth's eclipses and (when given) the Moon's; durations to the millisecond, depth to 1e-6. */
export function eclipsesCsv(earth: readonly EclipseRow[], moon: readonly EclipseRow[] | null): string {
  const rows = [
    ...earth.map((e) => ({ e, occulter: 'earth' })),
    ...(moon ?? []).map((e) => ({ e, occulter: 'moon' })),
  ].sort((x, y) => Date.parse(x.e.start) - Date.parse(y.e.start) || (x.occulter < y.occulter ? -1 : 1));
  const lines = rows.map(({ e, occulter }) => [
    e.start,
    e.stop,
    e.umbraStart ?? '',
    e.umbraStop ?? '',
    e.duration.toFixed(3),
    e.umbraDuration === null ? '' : e.umbraDuration.toFixed(3),
    e.depth.toFixed(6),
    occulter,
    String(e.startsBeforeWindow),
    String(e.endsAfterWindow),
  ].join(','));
  return [ECLIPSES_CSV_HEADER, ...lines].join(CRLF) + CRLF;
}
