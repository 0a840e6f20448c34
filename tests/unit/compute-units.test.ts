import { createUnit, unit } from 'mathjs'
import { describe, expect, it } from 'vitest'
import {
  AIR_DENSITY_SEA_LEVEL, celsiusToFahrenheit, fahrenheitToCelsius, hpToKw, kphToMph, kphToMs, kwToHp, kwToMetricHp,
  lbfFtToNm, metricHpToKw, mphToKph, msToKph, nmToLbfFt, radPerSecToRpm, rpmToRadPerSec, STANDARD_GRAVITY
} from '../../shared/compute/units'

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b)

describe('constants', () => {
  it('standard gravity is 9.80665 m/s² exactly (3rd CGPM 1901; NIST SP 330)', () => {
    expect(STANDARD_GRAVITY).toBe(9.80665)
  })

  it('sea-level air density matches p/(R·T) at 101 325 Pa, 288.15 K (ISO 2533:1975)', () => {
    const rSpecificAir = 287.05287 // J/(kg·K), ISO 2533
    expect(AIR_DENSITY_SEA_LEVEL).toBeCloseTo(101325 / (rSpecificAir * 288.15), 4)
  })
})

describe('power', () => {
  it('1 hp is 745.6999 W as NIST lists it (NIST SP 811, App. B.8)', () => {
    expect(hpToKw(1) * 1000).toBeCloseTo(745.6999, 4)
  })

  it('kW to hp agrees with mathjs as a second opinion to 1e-9', () => {
    for (const kw of [1, 45, 110, 220]) expect(rel(kwToHp(kw), unit(kw, 'kW').toNumber('hp'))).toBeLessThan(1e-9)
  })

  it('metric horsepower is 735.49875 W, 75 kgf·m/s (NIST SP 811, App. B.8), checked with a mathjs unit of our own', () => {
    // mathjs "PS" is peta-siemens, so metric horsepower is defined here from kgf·m/s.
    createUnit('metrichp', { definition: '75 kgf m / s' }, { override: true })
    expect(rel(kwToMetricHp(100), unit(100, 'kW').toNumber('metrichp'))).toBeLessThan(1e-9)
    expect(metricHpToKw(1) * 1000).toBeCloseTo(735.49875, 9)
  })

  it('hp and kW round-trip', () => {
    expect(kwToHp(hpToKw(123.4))).toBeCloseTo(123.4, 10)
  })
})

describe('speed', () => {
  it('1 mph is 1.609344 km/h exactly (NIST SP 811, international mile)', () => {
    expect(mphToKph(1)).toBe(1.609344)
    expect(kphToMph(1.609344 * 70)).toBeCloseTo(70, 12)
  })

  it('km/h to mph agrees with mathjs mi/h to 1e-12', () => {
    for (const kph of [30, 50, 100, 180]) expect(rel(kphToMph(kph), unit(kph, 'km/h').toNumber('mi/h'))).toBeLessThan(1e-12)
  })

  it('m/s and km/h: 100 km/h is 27.78 m/s, and back', () => {
    expect(kphToMs(100)).toBeCloseTo(1000 * 100 / 3600, 12)
    expect(msToKph(kphToMs(88))).toBeCloseTo(88, 12)
  })

  it('rpm and rad/s: 60 rpm is one revolution per second, 2π rad/s', () => {
    expect(rpmToRadPerSec(60)).toBeCloseTo(2 * Math.PI, 12)
    expect(radPerSecToRpm(rpmToRadPerSec(10000))).toBeCloseTo(10000, 9)
  })
})

describe('torque and temperature', () => {
  it('1 lbf·ft is 1.3558179 N·m (NIST SP 811), mathjs agreeing to 1e-7', () => {
    expect(lbfFtToNm(1)).toBe(1.3558179)
    expect(rel(nmToLbfFt(300), unit(300, 'N m').toNumber('lbf ft'))).toBeLessThan(1e-7)
  })

  it('t_C = (t_F − 32)/1.8 (NIST SP 811): 212 °F is 100 °C, −40 is −40, mathjs agreeing', () => {
    expect(fahrenheitToCelsius(212)).toBeCloseTo(100, 12)
    expect(fahrenheitToCelsius(-40)).toBeCloseTo(-40, 12)
    expect(celsiusToFahrenheit(0)).toBe(32)
    expect(fahrenheitToCelsius(150)).toBeCloseTo(unit(150, 'degF').toNumber('degC'), 9)
  })
})
