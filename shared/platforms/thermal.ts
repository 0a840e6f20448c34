// The thermal derating settings a mid-size drive unit's controller usually offers, in °C with their roles.
import { parameter } from './define'

export const midSizeThermal = {
  motorDerateStartC: parameter(['Motor derate start', '°C', 60, 160, 1, 130, 'Motor temperature at which torque starts to fade'], 'motorDerateStart'),
  motorCutoffC: parameter(['Motor cut-off', '°C', 80, 180, 1, 155, 'Motor temperature at which torque reaches zero'], 'motorCutoff'),
  inverterDerateStartC: parameter(['Inverter derate start', '°C', 50, 100, 1, 80, 'Inverter temperature at which torque starts to fade'], 'inverterDerateStart'),
  inverterCutoffC: parameter(['Inverter cut-off', '°C', 60, 115, 1, 95, 'Inverter temperature at which torque reaches zero'], 'inverterCutoff'),
  batteryDerateStartC: parameter(['Battery derate start', '°C', 30, 55, 1, 45, 'Pack temperature at which torque starts to fade'], 'batteryDerateStart'),
  batteryCutoffC: parameter(['Battery cut-off', '°C', 40, 65, 1, 58, 'Pack temperature at which torque reaches zero'], 'batteryCutoff')
}
