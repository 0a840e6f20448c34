// Standard tyre service-description tables (ISO 4000-1 / ETRTO; transcribed from memory, see tests).

// Load index → maximum load per tyre in kg, indices 0-150 (passenger car and light truck range).
const LOAD_KG_FROM_INDEX_0: readonly number[] = [
  45, 46.2, 47.5, 48.7, 50, 51.5, 53, 54.5, 56, 58, // 0-9
  60, 61.5, 63, 65, 67, 69, 71, 73, 75, 77.5, // 10-19
  80, 82.5, 85, 87.5, 90, 92.5, 95, 97.5, 100, 103, // 20-29
  106, 109, 112, 115, 118, 121, 125, 128, 132, 136, // 30-39
  140, 145, 150, 155, 160, 165, 170, 175, 180, 185, // 40-49
  190, 195, 200, 206, 212, 218, 224, 230, 236, 243, // 50-59
  250, 257, 265, 272, 280, 290, 300, 307, 315, 325, // 60-69
  335, 345, 355, 365, 375, 387, 400, 412, 425, 437, // 70-79
  450, 462, 475, 487, 500, 515, 530, 545, 560, 580, // 80-89
  600, 615, 630, 650, 670, 690, 710, 730, 750, 775, // 90-99
  800, 825, 850, 875, 900, 925, 950, 975, 1000, 1030, // 100-109
  1060, 1090, 1120, 1150, 1180, 1215, 1250, 1285, 1320, 1360, // 110-119
  1400, 1450, 1500, 1550, 1600, 1650, 1700, 1750, 1800, 1850, // 120-129
  1900, 1950, 2000, 2060, 2120, 2180, 2240, 2300, 2360, 2430, // 130-139
  2500, 2575, 2650, 2725, 2800, 2900, 3000, 3075, 3150, 3250, // 140-149
  3350 // 150
]

export const LOAD_INDEX_MIN = 0
export const LOAD_INDEX_MAX = LOAD_KG_FROM_INDEX_0.length - 1

// Per-tyre load capacity in kg, or null when the index is outside the table.
export function loadCapacityKg(loadIndex: number): number | null {
  if (!Number.isInteger(loadIndex) || loadIndex < LOAD_INDEX_MIN || loadIndex > LOAD_INDEX_MAX) return null
  return LOAD_KG_FROM_INDEX_0[loadIndex] ?? null
}

// Speed symbol → reference speed in km/h; H sits between U and V for historical reasons.
export const SPEED_SYMBOL_KPH: Readonly<Record<string, number>> = {
  B: 50, C: 60, D: 65, E: 70, F: 80, G: 90, J: 100, K: 110,
  L: 120, M: 130, N: 140, P: 150, Q: 160, R: 170, S: 180, T: 190, U: 200,
  H: 210, V: 240, W: 270, Y: 300
}

export function speedRatingKph(symbol: string): number | null {
  return SPEED_SYMBOL_KPH[symbol.toUpperCase()] ?? null
}
