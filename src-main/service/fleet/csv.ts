// CSV as RFC 4180 has it: comma-separated cells, a cell holding a comma, quote, CR or LF
// wrapped in double quotes with its quotes doubled, lines ending in CRLF. Reading also takes
// bare LF line ends and a leading byte-order mark, as spreadsheets write them.

export function csvCell(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(cells: readonly string[]): string {
  return cells.map(csvCell).join(',');
}

export function csvText(rows: readonly (readonly string[])[]): string {
  return rows.map((r) => `${csvLine(r)}\r\n`).join('');
}

export type CsvRead = { ok: true; rows: string[][] } | { ok: false; reason: string };

/** Rows of cells; a line that is wholly empty is skipped (a trailing newline, a blank line at the end). */
export function parseCsv(text: string): CsvRead {
  const body = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const rows: string[][] = [];
  let row: string[] = [];
  let cell = '';
  let quoted = false;
  let cellStarted = false;
  let line = 1;
  let quoteLine = 0;
  const endRow = () => {
    row.push(cell);
    if (!(row.length === 1 && row[0] === '' && !cellStarted)) rows.push(row);
    row = [];
    cell = '';
    cellStarted = false;
  };
  for (let i = 0; i < body.length; i++) {
    const c = body[i]!;
    if (quoted) {
      if (c === '"') {
        if (body[i + 1] === '"') {
          cell += '"';
          i++;
        } else {
          quoted = false;
          const next = body[i + 1];
          if (next !== undefined && next !== ',' && next !== '\r' && next !== '\n') {
            return { ok: false, reason: `line ${line}: text follows a closing quote; a quote inside a quoted cell is written twice ("")` };
          }
        }
      } else {
        if (c === '\n') line++;
        cell += c;
      }
      continue;
    }
    if (c === '"') {
      if (cell !== '') return { ok: false, reason: `line ${line}: a quote in the middle of an unquoted cell; quote the whole cell and write the quote twice ("")` };
      quoted = true;
      cellStarted = true;
      quoteLine = line;
    } else if (c === ',') {
      row.push(cell);
      cell = '';
      cellStarted = true;
    } else if (c === '\r' || c === '\n') {
      if (c === '\r' && body[i + 1] === '\n') i++;
      endRow();
      line++;
    } else {
      cell += c;
      cellStarted = true;
    }
  }
  if (quoted) return { ok: false, reason: `line ${quoteLine}: a quoted cell is never closed (the file may be cut off)` };
  if (cell !== '' || row.length > 0 || cellStarted) endRow();
  return { ok: true, rows };
}
