// Marrick 110: Voltwright's fictional mid-size drive unit for saloons, coupés and light sports cars.
import { definePlatform } from './define'

export const marrick110 = definePlatform('marrick-110', 'Marrick 110', 12000,
  'Mid-size drive unit, 110 kW peak, for cars of about 900 to 1500 kg.', {
    powerCapKw: ['Power cap', 'kW', 10, 110, 0.5, 80, 'Most power the motor may deliver'],
    torqueCapNm: ['Torque cap', 'N·m', 20, 280, 1, 220, 'Most torque the motor may deliver, at any speed'],
    regenTorqueLimitNm: ['Regen torque limit', 'N·m', 0, 220, 1, 100, 'Most braking torque regen may use'],
    liftOffRegenPct: ['Lift-off regen', '%', 0, 100, 1, 15, 'Share of the regen torque limit applied when the accelerator is released'],
    brakeRegenPct: ['Brake regen', '%', 0, 100, 1, 40, 'Share of the regen torque limit applied when the brake pedal is pressed'],
    creepTorqueNm: ['Creep torque', 'N·m', 0, 80, 0.5, 45, 'Torque applied at rest with the pedal up, so the car creeps like an automatic'],
    creepSpeedKph: ['Creep speed', 'km/h', 0, 10, 0.5, 5, 'Speed creep torque holds on the level'],
    speedLimitKph: ['Speed limit', 'km/h', 20, 200, 1, 150, 'Road speed above which the controller gives no more drive'],
    reverseSpeedLimitKph: ['Reverse speed limit', 'km/h', 2, 25, 1, 12, 'Road speed above which the controller gives no more drive in reverse'],
    throttleProgression: ['Throttle progression', '%', 0, 100, 5, 30, 'How much the first part of the pedal travel is softened; 0 % is a straight line'],
    motorDerateStartC: ['Motor derate start', '°C', 60, 160, 1, 130, 'Motor temperature at which torque starts to fade'],
    motorCutoffC: ['Motor cut-off', '°C', 80, 180, 1, 155, 'Motor temperature at which torque reaches zero'],
    inverterDerateStartC: ['Inverter derate start', '°C', 50, 100, 1, 80, 'Inverter temperature at which torque starts to fade'],
    inverterCutoffC: ['Inverter cut-off', '°C', 60, 115, 1, 95, 'Inverter temperature at which torque reaches zero'],
    batteryDerateStartC: ['Battery derate start', '°C', 30, 55, 1, 45, 'Pack temperature at which torque starts to fade'],
    batteryCutoffC: ['Battery cut-off', '°C', 40, 65, 1, 58, 'Pack temperature at which torque reaches zero'],
    batteryDischargeLimitA: ['Battery discharge limit', 'A', 20, 600, 1, 300, 'Most current the controller may draw from the pack'],
    batteryChargeLimitA: ['Battery charge limit', 'A', 0, 300, 1, 100, 'Most current regen may push into the pack']
  })
