// Fenlow 45: Voltwright's fictional compact drive unit for light cars (microcars, small saloons).
import { definePlatform } from './define'

export const fenlow45 = definePlatform('fenlow-45', 'Fenlow 45', 10000,
  'Compact drive unit, 45 kW peak, for light cars up to about 1000 kg.', {
    powerCapKw: ['Power cap', 'kW', 5, 45, 0.5, 40, 'Most power the motor may deliver'],
    torqueCapNm: ['Torque cap', 'N·m', 10, 160, 1, 140, 'Most torque the motor may deliver, at any speed'],
    regenTorqueLimitNm: ['Regen torque limit', 'N·m', 0, 120, 1, 60, 'Most braking torque regen may use'],
    liftOffRegenPct: ['Lift-off regen', '%', 0, 100, 1, 15, 'Share of the regen torque limit applied when the accelerator is released'],
    brakeRegenPct: ['Brake regen', '%', 0, 100, 1, 40, 'Share of the regen torque limit applied when the brake pedal is pressed'],
    creepTorqueNm: ['Creep torque', 'N·m', 0, 60, 0.5, 40, 'Torque applied at rest with the pedal up, so the car creeps like an automatic'],
    creepSpeedKph: ['Creep speed', 'km/h', 0, 10, 0.5, 5, 'Speed creep torque holds on the level'],
    speedLimitKph: ['Speed limit', 'km/h', 20, 150, 1, 130, 'Road speed above which the controller gives no more drive'],
    reverseSpeedLimitKph: ['Reverse speed limit', 'km/h', 2, 25, 1, 12, 'Road speed above which the controller gives no more drive in reverse'],
    throttleProgression: ['Throttle progression', '%', 0, 100, 5, 30, 'How much the first part of the pedal travel is softened; 0 % is a straight line'],
    motorDerateStartC: ['Motor derate start', '°C', 60, 150, 1, 120, 'Motor temperature at which torque starts to fade'],
    motorCutoffC: ['Motor cut-off', '°C', 80, 170, 1, 145, 'Motor temperature at which torque reaches zero'],
    inverterDerateStartC: ['Inverter derate start', '°C', 50, 95, 1, 75, 'Inverter temperature at which torque starts to fade'],
    inverterCutoffC: ['Inverter cut-off', '°C', 60, 110, 1, 90, 'Inverter temperature at which torque reaches zero'],
    batteryDerateStartC: ['Battery derate start', '°C', 30, 55, 1, 45, 'Pack temperature at which torque starts to fade'],
    batteryCutoffC: ['Battery cut-off', '°C', 40, 65, 1, 58, 'Pack temperature at which torque reaches zero'],
    batteryDischargeLimitA: ['Battery discharge limit', 'A', 10, 300, 1, 150, 'Most current the controller may draw from the pack'],
    batteryChargeLimitA: ['Battery charge limit', 'A', 0, 150, 1, 60, 'Most current regen may push into the pack']
  })
