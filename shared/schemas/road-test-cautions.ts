// Before a road test sets off: what a careful workshop tells its tester (common practice), in Voltwright's
// own words. The tester ticks that they have read them and the car is ready; the record keeps the titles as
// they stood that day (docs/road-tests.md#before-you-set-off).
export interface PreDriveCaution { title: string, text: string }

export const preDriveCautions: PreDriveCaution[] = [
  { title: 'Two people, a quiet road', text: 'Take a second person to watch the road and the controller\'s readings. Test on a closed or quiet road, where the local rules allow it, with room to stop clear of anyone.' },
  { title: 'Brakes first, regen off', text: 'Before any check, with regen switched off, stop the car from walking pace and then from 30 km/h on its own brakes: it must pull up straight. The car\'s brakes have to stop it whatever the controller does.' },
  { title: 'Know the settings and the way back', text: 'Know which version is on the controller, what it changed, and how to put the previous settings back at the roadside, or switch the drive off, if it misbehaves.' },
  { title: 'Tyres and wheels', text: 'Tyre pressures set cold to the workshop\'s figure, tread and sidewalls sound, wheel nuts at their torque.' },
  { title: 'Stop at the first doubt', text: 'At the first pull, snatch, smell, noise, warning light or temperature you did not expect, stop where it is safe and switch the drive off. Record it as a failed check rather than pushing on to finish the list.' },
  { title: 'High voltage', text: 'Nobody opens or touches the high-voltage system at the roadside. If a cable or the pack is damaged, hot or smells, keep everyone clear and call the workshop.' }
]

export const preDriveDeferral = 'These cautions help; they do not replace the regulations where you drive (road use, insurance, trade plates) or the workshop\'s qualified engineer, whose word goes where they say more.'

export const preDriveConfirmLabel = 'I have read these cautions and the car is ready to set off'

// What a road test keeps of the confirmation: the cautions' titles as the tester read them.
export interface PreDriveRecord { confirmed: true, cautions: string[] }

export const preDriveRecord = (): PreDriveRecord => ({ confirmed: true, cautions: preDriveCautions.map(c => c.title) })

// "Tessa Quill read the pre-drive cautions (“Two people, a quiet road”, ...) and confirmed the car was ready."
export function preDriveText(record: unknown, who: string): string {
  const r = record as Partial<PreDriveRecord> | null | undefined
  if (!r?.confirmed) return 'No pre-drive confirmation is on this record: it was recorded before Voltwright asked for one.'
  const list = Array.isArray(r.cautions) && r.cautions.length ? ` (${r.cautions.map(c => `“${String(c)}”`).join(', ')})` : ''
  return `${who || 'The tester'} read the pre-drive cautions${list} and confirmed the car was ready to set off.`
}
