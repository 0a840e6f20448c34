// Numbers and dates written through Intl formatters made once and kept. `toLocaleString` with options builds
// a new formatter on every call, which was a sixth of the version diff's time (docs/architecture.md, "Speed").
// The options come from the code, never from a request, so the kept formatters stay a handful.
const numberFormats = new Map<string, Intl.NumberFormat>()
const dateFormats = new Map<string, Intl.DateTimeFormat>()

function kept<T>(store: Map<string, T>, key: string, make: () => T): T {
  let f = store.get(key)
  if (!f) store.set(key, f = make())
  return f
}

// `x.toLocaleString(locale, options)`, the same text.
export function localeNumber(x: number, options: Intl.NumberFormatOptions = {}, locale = 'en-GB'): string {
  return kept(numberFormats, `${locale}|${JSON.stringify(options)}`, () => new Intl.NumberFormat(locale, options)).format(x)
}

// `d.toLocaleString(locale, options)` for dates and times, the same text.
export function localeDateParts(d: Date, options: Intl.DateTimeFormatOptions, locale = 'en-GB'): string {
  return kept(dateFormats, `${locale}|${JSON.stringify(options)}`, () => new Intl.DateTimeFormat(locale, options)).format(d)
}
