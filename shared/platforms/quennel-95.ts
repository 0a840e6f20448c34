// Quennel 95: Voltwright's fictional drive unit with no creep at all, but a hill-hold switch, drive modes
// and a throttle map (pedal % → torque %) in place of a single progression setting.
import type { OtherSettingProperty } from '../compute/types'
import { parameter, platformOf } from './define'
import { midSizeThermal } from './thermal'

const axis = (title: string) => ({ type: 'number', title, unit: '%', minimum: 0, maximum: 100 })

const hillHold: OtherSettingProperty = { type: 'boolean', title: 'Hill hold', description: 'Holds the car for two seconds after the brake is released on a slope', default: true }
const driveMode: OtherSettingProperty = {
  'type': 'string', 'title': 'Drive mode', 'description': 'How eagerly the car responds to the pedal',
  'enum': ['eco', 'normal', 'sport'], 'x-enumTitles': ['Eco', 'Normal', 'Sport'], 'default': 'normal'
}
const throttleMap: OtherSettingProperty = {
  'type': 'array', 'title': 'Throttle map', 'description': 'Torque asked for at each pedal position; it never falls as the pedal goes down',
  'items': { type: 'object', properties: { x: axis('Pedal'), y: axis('Torque') }, required: ['x', 'y'], additionalProperties: false },
  'minItems': 2, 'maxItems': 12, 'x-monotonic': true,
  'default': [{ x: 0, y: 0 }, { x: 25, y: 12 }, { x: 50, y: 35 }, { x: 75, y: 65 }, { x: 100, y: 100 }]
}

export const quennel95 = platformOf('quennel-95', 'Quennel 95', 10500,
  'Drive unit, 95 kW peak, with hill hold, drive modes and a throttle map; it has no creep.', {
    powerCapKw: parameter(['Power cap', 'kW', 10, 95, 0.5, 75, 'Most power the motor may deliver'], 'powerCap'),
    torqueCapNm: parameter(['Torque cap', 'N·m', 20, 250, 1, 200, 'Most torque the motor may deliver, at any speed'], 'torqueCap'),
    regenTorqueLimitNm: parameter(['Regen torque limit', 'N·m', 0, 180, 1, 90, 'Most braking torque regen may use'], 'regenTorqueLimit'),
    liftOffRegenPct: parameter(['Lift-off regen', '%', 0, 100, 1, 15, 'Share of the regen torque limit applied when the accelerator is released'], 'liftOffRegen'),
    brakeRegenPct: parameter(['Brake regen', '%', 0, 100, 1, 40, 'Share of the regen torque limit applied when the brake pedal is pressed'], 'brakeRegen'),
    hillHold,
    driveMode,
    throttleMap,
    speedLimitKph: parameter(['Speed limit', 'km/h', 20, 190, 1, 150, 'Road speed above which the controller gives no more drive'], 'speedLimit'),
    reverseSpeedLimitKph: parameter(['Reverse speed limit', 'km/h', 2, 25, 1, 12, 'Road speed above which the controller gives no more drive in reverse'], 'reverseSpeedLimit'),
    ...midSizeThermal,
    batteryDischargeLimitA: parameter(['Battery discharge limit', 'A', 20, 500, 1, 280, 'Most current the controller may draw from the pack'], 'batteryDischargeLimit'),
    batteryChargeLimitA: parameter(['Battery charge limit', 'A', 0, 250, 1, 90, 'Most current regen may push into the pack'], 'batteryChargeLimit')
  })
