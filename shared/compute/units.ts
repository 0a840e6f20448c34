// Unit conversions and physical constants used throughout the computation.

export const STANDARD_GRAVITY = 9.80665 // m/s², exact (3rd CGPM 1901; NIST SP 330)
export const AIR_DENSITY_SEA_LEVEL = 1.225 // kg/m³ at 288.15 K, 101 325 Pa (ISO 2533:1975)
export const HORSEPOWER_W = 745.69987158 // 550 ft·lbf/s (NIST SP 811, App. B.8)
export const METRIC_HORSEPOWER_W = 735.49875 // 75 kgf·m/s, exact (NIST SP 811, App. B.8)
export const KPH_PER_MPH = 1.609344 // international mile, exact (NIST SP 811)
export const NM_PER_LBF_FT = 1.3558179 // pound-force foot (NIST SP 811)

// Mechanical horsepower, for owners who know their car's engine in hp.
export const kwToHp = (kw: number): number => (kw * 1000) / HORSEPOWER_W
export const hpToKw = (hp: number): number => (hp * HORSEPOWER_W) / 1000

// Metric horsepower (PS), the figure in many period brochures.
export const kwToMetricHp = (kw: number): number => (kw * 1000) / METRIC_HORSEPOWER_W
export const metricHpToKw = (ps: number): number => (ps * METRIC_HORSEPOWER_W) / 1000

export const kphToMph = (kph: number): number => kph / KPH_PER_MPH
export const mphToKph = (mph: number): number => mph * KPH_PER_MPH

export const nmToLbfFt = (nm: number): number => nm / NM_PER_LBF_FT
export const lbfFtToNm = (lbfFt: number): number => lbfFt * NM_PER_LBF_FT

// t_C = (t_F − 32)/1.8 (NIST SP 811)
export const fahrenheitToCelsius = (f: number): number => (f - 32) / 1.8
export const celsiusToFahrenheit = (c: number): number => c * 1.8 + 32

// 1 km/h = 1000 m / 3600 s
export const msToKph = (ms: number): number => ms * 3.6
export const kphToMs = (kph: number): number => kph / 3.6

// 1 rev/min = 2π rad / 60 s
export const radPerSecToRpm = (omega: number): number => (omega * 60) / (2 * Math.PI)
export const rpmToRadPerSec = (rpm: number): number => (rpm * 2 * Math.PI) / 60

export const mmToM = (mm: number): number => mm / 1000
