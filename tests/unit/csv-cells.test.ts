import { describe, expect, it } from 'vitest'
import { parse } from 'csv-parse/sync'
import { csvCell, csvLine, neutraliseFormulas } from '../../server/utils/history/csv'

// What a spreadsheet may run as a formula: a cell, or any part of it after a comma, semicolon or tab, starting
// with = + - @, a tab or a carriage return (OWASP, "CSV Injection").
describe('CSV cells', () => {
  it('quotes every cell, doubling quotes inside (RFC 4180 section 2)', () => {
    expect(csvCell('plain')).toBe('"plain"')
    expect(csvCell('')).toBe('""')
    expect(csvCell('a,b')).toBe('"a,b"')
    expect(csvCell('two\r\nlines')).toBe('"two\r\nlines"')
    expect(csvCell('say "hi"')).toBe('"say ""hi"""')
  })

  it.each([
    ['=HYPERLINK("x")', '\'=HYPERLINK("x")'],
    ['+1+1', '\'+1+1'],
    ['@SUM(A1)', '\'@SUM(A1)'],
    ['-2+3', '\'-2+3'],
    ['\t=1', '\'\t\'=1'],
    ['\r=1', '\'\r\'=1'],
    ['\tplain', '\'\tplain'],
    ['ok,=cmd()', 'ok,\'=cmd()'],
    ['ok;+cmd()', 'ok;\'+cmd()'],
    ['ok\t@cmd()', 'ok\t\'@cmd()'],
    ['ok, =cmd()', 'ok,\' =cmd()'],
    ['a\n=b', 'a\n\'=b']
  ])('neutralises %j wherever a spreadsheet may split it', (raw, safe) => {
    expect(neutraliseFormulas(raw)).toBe(safe)
  })

  it.each(['-12.5', '1,-2', 'Kerb mass: 1050 → 1075', 'a=b', 'x@y.test'])('leaves %j as it is', (raw) => {
    expect(neutraliseFormulas(raw)).toBe(raw)
  })

  it('reads back with a standard parser as the neutralised text', () => {
    const line = csvLine(['1', 'ok,=cmd()', 'say "hi"', 'two\r\nlines'])
    expect(parse(line)).toEqual([['1', 'ok,\'=cmd()', 'say "hi"', 'two\r\nlines']])
  })
})
