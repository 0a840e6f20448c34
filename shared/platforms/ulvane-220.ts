// Ulvane 220: Voltwright's fictional large drive unit for big saloons, estates and light commercials.
import { definePlatform } from './define'

export const ulvane220 = definePlatform('ulvane-220', 'Ulvane 220', 10500,
  'Large drive unit, 220 kW peak, for heavy cars of about 1400 to 2500 kg.', {
    powerCapKw: ['Power cap', 'kW', 20, 220, 1, 150, 'Most power the motor may deliver'],
    torqueCapNm: ['Torque cap', 'N·m', 50, 500, 5, 400, 'Most torque the motor may deliver, at any speed'],
    regenTorqueLimitNm: ['Regen torque limit', 'N·m', 0, 400, 5, 180, 'Most braking torque regen may use'],
    liftOffRegenPct: ['Lift-off regen', '%', 0, 100, 1, 15, 'Share of the regen torque limit applied when the accelerator is released'],
    brakeRegenPct: ['Brake regen', '%', 0, 100, 1, 40, 'Share of the regen torque limit applied when the brake pedal is pressed'],
    creepTorqueNm: ['Creep torque', 'N·m', 0, 120, 1, 50, 'Torque applied at rest with the pedal up, so the car creeps like an automatic'],
    creepSpeedKph: ['Creep speed', 'km/h', 0, 10, 0.5, 5, 'Speed creep torque holds on the level'],
    speedLimitKph: ['Speed limit', 'km/h', 20, 220, 1, 160, 'Road speed above which the controller gives no more drive'],
    reverseSpeedLimitKph: ['Reverse speed limit', 'km/h', 2, 25, 1, 12, 'Road speed above which the controller gives no more drive in reverse'],
    throttleProgression: ['Throttle progression', '%', 0, 100, 5, 40, 'How much the first part of the pedal travel is softened; 0 % is a straight line'],
    motorDerateStartC: ['Motor derate start', '°C', 60, 160, 1, 130, 'Motor temperature at which torque starts to fade'],
    motorCutoffC: ['Motor cut-off', '°C', 80, 180, 1, 160, 'Motor temperature at which torque reaches zero'],
    inverterDerateStartC: ['Inverter derate start', '°C', 50, 100, 1, 80, 'Inverter temperature at which torque starts to fade'],
    inverterCutoffC: ['Inverter cut-off', '°C', 60, 115, 1, 95, 'Inverter temperature at which torque reaches zero'],
    batteryDerateStartC: ['Battery derate start', '°C', 30, 55, 1, 45, 'Pack temperature at which torque starts to fade'],
    batteryCutoffC: ['Battery cut-off', '°C', 40, 65, 1, 58, 'Pack temperature at which torque reaches zero'],
    batteryDischargeLimitA: ['Battery discharge limit', 'A', 50, 900, 5, 500, 'Most current the controller may draw from the pack'],
    batteryChargeLimitA: ['Battery charge limit', 'A', 0, 450, 5, 150, 'Most current regen may push into the pack']
  })
