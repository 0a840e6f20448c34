// Every cell quoted (RFC 4180). A spreadsheet may split a cell again on a comma, semicolon or tab (or a
// line break) and run any part that starts with = + - @, a tab or a carriage return as a formula, so each
// such part is prefixed with an apostrophe (OWASP, CSV injection); a plain negative number is left alone.
const SEPARATOR = /([,;\t\r\n])/
const FORMULA_START = /^\s*[=+\-@\t\r]/
const PLAIN_NUMBER = /^\s*-?\d+(\.\d+)?\s*$/

export function neutraliseFormulas(value: string): string {
  const start = /^[\t\r]/.test(value) ? `'${value}` : value // a leading tab or CR is itself the danger
  return start.split(SEPARATOR)
    .map((part, i) => i % 2 === 0 && FORMULA_START.test(part) && !PLAIN_NUMBER.test(part) ? `'${part}` : part)
    .join('')
}

export function csvCell(value: string): string {
  return `"${neutraliseFormulas(value).replace(/"/g, '""')}"`
}

export function csvLine(cells: string[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`
}

