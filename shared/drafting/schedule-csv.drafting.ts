/**
 * The member schedule as CSV (RFC 4180): CRLF line ends, a single header line first (no
 * comment lines), fields quoted when they hold a comma, quote, CR or LF, quotes doubled.
 * Units live in the column names; numbers are plain (no unit text, no thousands separators).
 * The caution travels in the X-Baywright-Caution response header so the file stays
 * machine-readable.
 */
import type { ScheduleMarkRow, ScheduleRow } from './schedule.drafting';

export interface CsvColumn<Row = ScheduleRow> {
  header: string;
  value: (row: Row) => string | number | null;
}

/** Numbers to a fixed precision, trailing zeros kept off ("12.5", not "12.500"). */
function num(value: number | null, digits: number): string {
  if (value === null || !Number.isFinite(value)) return '';
  const text = Number(value.toFixed(digits)).toString();
  return text === '-0' ? '0' : text;
}

/** Ratios are rounded up so the file never understates a member's utilisation. */
function ratioText(ratio: number | null): string {
  return ratio === null || !Number.isFinite(ratio) ? '' : String(Math.ceil(ratio * 1000 - 1e-9) / 1000);
}

export const SCHEDULE_CSV_COLUMNS: readonly CsvColumn[] = [
  { header: 'level', value: (r) => r.level },
  { header: 'level_name', value: (r) => r.levelName },
  { header: 'mark', value: (r) => r.mark },
  { header: 'member_id', value: (r) => r.memberId },
  { header: 'kind', value: (r) => r.kind },
  { header: 'size', value: (r) => r.size ?? '' },
  { header: 'count_same_mark', value: (r) => r.count },
  { header: 'span_ft', value: (r) => num(r.span_ft, 3) },
  { header: 'grid_location', value: (r) => r.gridLocation ?? '' },
  { header: 'R_start_D_kip', value: (r) => num(r.start.D_kip, 3) },
  { header: 'R_start_L_kip', value: (r) => num(r.start.L_kip, 3) },
  { header: 'R_start_Lr_kip', value: (r) => num(r.start.Lr_kip, 3) },
  { header: 'R_start_S_kip', value: (r) => num(r.start.S_kip, 3) },
  { header: 'R_start_factored_kip', value: (r) => num(r.start.factored_kip, 3) },
  { header: 'R_start_combination', value: (r) => r.start.combination },
  { header: 'R_start_supported_by', value: (r) => r.start.supportedBy ?? '' },
  { header: 'R_end_D_kip', value: (r) => num(r.end.D_kip, 3) },
  { header: 'R_end_L_kip', value: (r) => num(r.end.L_kip, 3) },
  { header: 'R_end_Lr_kip', value: (r) => num(r.end.Lr_kip, 3) },
  { header: 'R_end_S_kip', value: (r) => num(r.end.S_kip, 3) },
  { header: 'R_end_factored_kip', value: (r) => num(r.end.factored_kip, 3) },
  { header: 'R_end_combination', value: (r) => r.end.combination },
  { header: 'R_end_supported_by', value: (r) => r.end.supportedBy ?? '' },
  { header: 'governing', value: (r) => r.governing ?? '' },
  { header: 'ratio', value: (r) => ratioText(r.ratio) },
  { header: 'passes', value: (r) => (r.passes ? 'yes' : 'no') },
  { header: 'weight_plf', value: (r) => num(r.weight_plf, 2) },
  { header: 'camber_in', value: (r) => num(r.camber_in, 2) },
  { header: 'studs', value: (r) => (r.studs === null ? '' : r.studs) },
];

/**
 * One row per piece mark. The reaction columns are the envelope over both ends of every member
 * of the row (the column names say so); grid locations are joined with "; ".
 */
export const SCHEDULE_MARK_CSV_COLUMNS: readonly CsvColumn<ScheduleMarkRow>[] = [
  { header: 'level', value: (r) => r.level },
  { header: 'level_name', value: (r) => r.levelName },
  { header: 'mark', value: (r) => r.mark },
  { header: 'kind', value: (r) => r.kind },
  { header: 'size', value: (r) => r.size ?? '' },
  { header: 'quantity', value: (r) => r.quantity },
  { header: 'span_ft', value: (r) => num(r.span_ft, 3) },
  { header: 'grid_locations', value: (r) => r.gridLocations.join('; ') },
  { header: 'R_envelope_D_kip', value: (r) => num(r.reaction.D_kip, 3) },
  { header: 'R_envelope_L_kip', value: (r) => num(r.reaction.L_kip, 3) },
  { header: 'R_envelope_Lr_kip', value: (r) => num(r.reaction.Lr_kip, 3) },
  { header: 'R_envelope_S_kip', value: (r) => num(r.reaction.S_kip, 3) },
  { header: 'R_envelope_factored_kip', value: (r) => num(r.reaction.factored_kip, 3) },
  { header: 'R_envelope_combination', value: (r) => r.reaction.combination },
  { header: 'governing', value: (r) => r.governing ?? '' },
  { header: 'ratio_max', value: (r) => ratioText(r.ratio) },
  { header: 'passes', value: (r) => (r.passes ? 'yes' : 'no') },
  { header: 'weight_plf', value: (r) => num(r.weight_plf, 2) },
  { header: 'camber_in', value: (r) => num(r.camber_in, 2) },
  { header: 'studs', value: (r) => (r.studs === null ? '' : r.studs) },
  { header: 'mark_split', value: (r) => (r.split ? 'yes' : 'no') },
  { header: 'member_ids', value: (r) => r.memberIds.join(' ') },
];

/** One RFC 4180 field. */
export function csvField(value: string | number | null): string {
  const text = value === null ? '' : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function scheduleCsv<Row = ScheduleRow>(rows: readonly Row[], columns: readonly CsvColumn<Row>[] = SCHEDULE_CSV_COLUMNS as unknown as readonly CsvColumn<Row>[]): string {
  const lines = [columns.map((c) => csvField(c.header)).join(',')];
  for (const row of rows) lines.push(columns.map((c) => csvField(c.value(row))).join(','));
  return `${lines.join('\r\n')}\r\n`;
}

/** Parses RFC 4180 text into records (for tests and for anyone round-tripping the file). */
export function parseCsv(text: string): string[][] {
  const records: string[][] = [];
  let field = '';
  let record: string[] = [];
  let i = 0;
  let quoted = false;
  while (i < text.length) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"') {
        if (text[i + 1] === '"') {
          field += '"';
          i += 2;
          continue;
        }
        quoted = false;
      } else field += ch;
      i++;
      continue;
    }
    if (ch === '"') quoted = true;
    else if (ch === ',') {
      record.push(field);
      field = '';
    } else if (ch === '\r' && text[i + 1] === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
      i++;
    } else if (ch === '\n') {
      record.push(field);
      records.push(record);
      record = [];
      field = '';
    } else field += ch;
    i++;
  }
  if (field !== '' || record.length > 0) {
    record.push(field);
    records.push(record);
  }
  return records;
}
