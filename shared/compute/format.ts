// Numbers as a message shows them: a few significant figures, no trailing zeros.
export function formatNumber(x: number, digits = 3): string {
  if (!Number.isFinite(x)) return String(x)
  const abs = Math.abs(x)
  const decimals = abs >= 100 ? 0 : abs >= 10 ? Math.max(0, digits - 2) : Math.max(0, digits - 1)
  return String(Number(x.toFixed(decimals)))
}

export function withUnit(x: number, unit?: string): string {
  return unit ? `${formatNumber(x)} ${unit}` : formatNumber(x)
}
