// CSV as RFC 4180 describes it (comma separated, CRLF line ends, fields with commas, quotes or
// line breaks quoted, quotes doubled), for files the office opens in a spreadsheet.

// A text cell starting with one of these is run as a formula by spreadsheet programs; a leading
// apostrophe keeps it text (OWASP, "CSV Injection").
const FORMULA_START = /^[=+\-@\t\r]/;

function cell(value: string | number | null): string {
  if (value === null) return '';
  if (typeof value === 'number') return String(value);
  const text = FORMULA_START.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(rows: readonly (readonly (string | number | null)[])[]): string {
  return rows.map((row) => row.map(cell).join(',')).join('\r\n') + '\r\n';
}
