import { describe, expect, it } from 'vitest'
import { parameterRows, settingsPatch } from '../../server/utils/versions/diff'
import { defaultParameters, marrick110, peltry70, quennel95 } from '../../shared/platforms/index'

describe('settings compared between versions', () => {
  it('a setting given in another unit on the other side is removed and added (RFC 6902), never replaced', () => {
    const a = { ...defaultParameters(marrick110), liftOffRegen: 15 }
    const schemaA = structuredClone(marrick110.schema) as unknown as { properties: Record<string, Record<string, unknown>> }
    schemaA.properties.liftOffRegen = { ...schemaA.properties.liftOffRegenPct, unit: '%' }
    const b = { ...defaultParameters(peltry70) }
    const patch = settingsPatch({ ...a }, b, schemaA, peltry70.schema)
    expect(patch).toEqual(expect.arrayContaining([{ op: 'remove', path: '/liftOffRegen' }, { op: 'add', path: '/liftOffRegen', value: 0.15 }]))
    expect(patch.some(o => o.path === '/liftOffRegen' && o.op === 'replace')).toBe(false)
    expect(patch).toEqual(expect.arrayContaining([{ op: 'add', path: '/powerCapHp', value: 75 }, { op: 'remove', path: '/powerCapKw' }]))
  })

  it('a change in the same unit is a replace, and rows say switches, choices and curves in words', () => {
    const a = defaultParameters(quennel95)
    const b = { ...a, hillHold: false, driveMode: 'sport', torqueCapNm: 180 }
    expect(settingsPatch(a, b, quennel95.schema, quennel95.schema)).toEqual(expect.arrayContaining([
      { op: 'replace', path: '/hillHold', value: false }, { op: 'replace', path: '/driveMode', value: 'sport' }, { op: 'replace', path: '/torqueCapNm', value: 180 }
    ]))
    const rows = parameterRows(a, b, [quennel95.schema, quennel95.schema], quennel95.schema)
    const row = (n: string) => rows.find(r => r.name === n)!
    expect(row('hillHold')).toMatchObject({ label: 'Hill hold', beforeText: 'On', afterText: 'Off', changed: true, change: null })
    expect(row('driveMode')).toMatchObject({ beforeText: 'Normal', afterText: 'Sport', changed: true })
    expect(row('torqueCapNm')).toMatchObject({ unit: 'N·m', change: -20, changed: true, afterText: '180 N·m' })
    expect(row('throttleMap')).toMatchObject({ changed: false, beforeText: expect.stringContaining('(pedal % → torque %)') })
  })
})
