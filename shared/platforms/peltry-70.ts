// Peltry 70: Voltwright's fictional drive unit whose controller takes power in hp, speeds in mph and
// regen as a fraction from 0 to 1.
import { parameter, platformOf } from './define'

export const peltry70 = platformOf('peltry-70', 'Peltry 70', 9500,
  'Drive unit, about 94 hp (70 kW) peak, for light and mid-size cars; its controller works in hp, mph and regen fractions.', {
    powerCapHp: parameter(['Power cap', 'hp', 10, 94, 1, 75, 'Most power the motor may deliver'], 'powerCap'),
    torqueCapNm: parameter(['Torque cap', 'N·m', 20, 210, 1, 180, 'Most torque the motor may deliver, at any speed'], 'torqueCap'),
    regenTorqueNm: parameter(['Regen torque', 'N·m', 0, 160, 1, 80, 'Most braking torque regen may use'], 'regenTorqueLimit'),
    liftOffRegen: parameter(['Lift-off regen', 'fraction', 0, 1, 0.01, 0.15, 'Share of the regen torque applied when the accelerator is released, from 0 (none) to 1 (all)'], 'liftOffRegen'),
    brakeRegen: parameter(['Brake regen', 'fraction', 0, 1, 0.01, 0.4, 'Share of the regen torque applied when the brake pedal is pressed, from 0 to 1'], 'brakeRegen'),
    creepTorqueNm: parameter(['Creep torque', 'N·m', 0, 60, 0.5, 35, 'Torque applied at rest with the pedal up'], 'creepTorque'),
    creepSpeedMph: parameter(['Creep speed', 'mph', 0, 6, 0.5, 3, 'Speed creep torque holds on the level'], 'creepSpeed'),
    speedLimitMph: parameter(['Speed limit', 'mph', 15, 110, 1, 80, 'Road speed above which the controller gives no more drive'], 'speedLimit'),
    reverseSpeedLimitMph: parameter(['Reverse speed limit', 'mph', 2, 15, 1, 8, 'Road speed above which the controller gives no more drive in reverse'], 'reverseSpeedLimit'),
    throttleProgression: parameter(['Throttle progression', '%', 0, 100, 5, 30, 'How much the first part of the pedal travel is softened'], 'throttleProgression'),
    motorDerateStartC: parameter(['Motor derate start', '°C', 60, 150, 1, 120, 'Motor temperature at which torque starts to fade'], 'motorDerateStart'),
    motorCutoffC: parameter(['Motor cut-off', '°C', 80, 170, 1, 145, 'Motor temperature at which torque reaches zero'], 'motorCutoff'),
    inverterDerateStartC: parameter(['Inverter derate start', '°C', 50, 95, 1, 75, 'Inverter temperature at which torque starts to fade'], 'inverterDerateStart'),
    inverterCutoffC: parameter(['Inverter cut-off', '°C', 60, 110, 1, 90, 'Inverter temperature at which torque reaches zero'], 'inverterCutoff'),
    batteryDerateStartC: parameter(['Battery derate start', '°C', 30, 55, 1, 45, 'Pack temperature at which torque starts to fade'], 'batteryDerateStart'),
    batteryCutoffC: parameter(['Battery cut-off', '°C', 40, 65, 1, 58, 'Pack temperature at which torque reaches zero'], 'batteryCutoff'),
    batteryDischargeLimitA: parameter(['Battery discharge limit', 'A', 10, 400, 1, 220, 'Most current the controller may draw from the pack'], 'batteryDischargeLimit'),
    batteryChargeLimitA: parameter(['Battery charge limit', 'A', 0, 200, 1, 80, 'Most current regen may push into the pack'], 'batteryChargeLimit')
  })
