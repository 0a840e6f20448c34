// Corvath 130: Voltwright's fictional drive unit whose controller caps motor current in amps rather than
// torque; its torque constant turns those currents into torque for the computation.
import { parameter, platformOf } from './define'
import { midSizeThermal } from './thermal'

export const corvath130 = platformOf('corvath-130', 'Corvath 130', 11000,
  'Drive unit, 130 kW peak, whose controller limits motor current (A) rather than torque; 0.85 N·m per A.', {
    powerLimitKw: parameter(['Power limit', 'kW', 10, 130, 0.5, 90, 'Most power the motor may deliver'], 'powerCap'),
    motorCurrentLimitA: parameter(['Motor current limit', 'A', 20, 360, 1, 280, 'Most phase current the motor may draw; torque is about 0.85 N·m per A'], 'torqueCap'),
    regenCurrentLimitA: parameter(['Regen current limit', 'A', 0, 260, 1, 120, 'Most phase current regen may use'], 'regenTorqueLimit'),
    coastRegenPct: parameter(['Coast regen', '%', 0, 100, 1, 15, 'Share of the regen current limit applied when the accelerator is released'], 'liftOffRegen'),
    brakeRegenPct: parameter(['Brake regen', '%', 0, 100, 1, 40, 'Share of the regen current limit applied when the brake pedal is pressed'], 'brakeRegen'),
    creepTorqueNm: parameter(['Creep torque', 'N·m', 0, 80, 0.5, 40, 'Torque applied at rest with the pedal up'], 'creepTorque'),
    creepSpeedKph: parameter(['Creep speed', 'km/h', 0, 10, 0.5, 5, 'Speed creep torque holds on the level'], 'creepSpeed'),
    speedLimitKph: parameter(['Speed limit', 'km/h', 20, 200, 1, 150, 'Road speed above which the controller gives no more drive'], 'speedLimit'),
    reverseSpeedLimitKph: parameter(['Reverse speed limit', 'km/h', 2, 25, 1, 12, 'Road speed above which the controller gives no more drive in reverse'], 'reverseSpeedLimit'),
    throttleProgression: parameter(['Throttle progression', '%', 0, 100, 5, 30, 'How much the first part of the pedal travel is softened'], 'throttleProgression'),
    ...midSizeThermal,
    batteryDischargeLimitA: parameter(['Battery discharge limit', 'A', 20, 600, 1, 300, 'Most current the controller may draw from the pack'], 'batteryDischargeLimit'),
    batteryChargeLimitA: parameter(['Battery charge limit', 'A', 0, 300, 1, 100, 'Most current regen may push into the pack'], 'batteryChargeLimit')
  }, 0.85)
