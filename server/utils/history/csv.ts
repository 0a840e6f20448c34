// RFC 4180 quoting; a cell a spreadsheet would run as a formula is prefixed with an apostrophe (OWASP CSV injection).
export function csvCell(value: string): string {
  const safe = /^[=+\-@\t\r]/.test(value) && !/^-?\d+(\.\d+)?$/.test(value) ? `'${value}` : value
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe
}

export function csvLine(cells: string[]): string {
  return `${cells.map(csvCell).join(',')}\r\n`
}

// Every cell quoted, for exports a person opens in a spreadsheet; the same formula neutralising as csvCell.
export function csvQuotedLine(cells: string[]): string {
  return `${cells.map((c) => {
    const cell = csvCell(c)
    return cell.startsWith('"') ? cell : `"${cell}"`
  }).join(',')}\r\n`
}
