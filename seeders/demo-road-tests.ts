// The demo workshop's road tests and snags; invented for the demo.
const pass = (key: string, values: Record<string, unknown>, note = '') => ({ key, verdict: 'pass', values, note })

export const demoRoadTests = [
  { stockRef: 'OF-103', profile: 'Road', versionNo: 1, conditions: { surface: 'dry', ambientC: 17, route: 'Forge loop, Tanner\'s Hill (14 %)' },
    checks: [pass('hill-start', { gradientPct: 14, rollbackMm: 40 }), pass('lift-off-regen', { feel: 'gentle' }), pass('brake-regen', {}), pass('creep', { speedKph: 4 }), pass('full-power', { peakSpeedKph: 104 }), pass('thermal-soak', { motorC: 71, inverterC: 55, batteryC: 29 }, 'After 45 minutes')] },
  { stockRef: 'OF-103', profile: 'Valet', versionNo: 1, conditions: { surface: 'dry', ambientC: 16, route: 'Yard and village' },
    checks: [pass('hill-start', { gradientPct: 10, rollbackMm: 30 }), pass('lift-off-regen', { feel: 'gentle' }), pass('brake-regen', {}), pass('creep', { speedKph: 3 }), pass('full-power', { peakSpeedKph: 50 }, 'Held at the limit'), pass('thermal-soak', { motorC: 48, inverterC: 41, batteryC: 24 })] },
  { stockRef: 'OF-104', profile: 'Road', versionNo: 1, conditions: { surface: 'wet', ambientC: 9, route: 'Forge loop, Quarry Lane (18 %), the Mill roundabout' },
    checks: [pass('hill-start', { gradientPct: 18, rollbackMm: 70 }), pass('lift-off-regen', { feel: 'firm', decelMs2: 0.8 }, 'Abrupt on the wet roundabout; within grip'), pass('brake-regen', { decelMs2: 1.4 }), pass('creep', { speedKph: 5 }), pass('full-power', { peakSpeedKph: 142, zeroTo50S: 4.1 }), pass('thermal-soak', { motorC: 92, inverterC: 71, batteryC: 34 }, 'Inverter warm after the full-power pull, as the engineer asked us to watch')] }
]

export const demoSnags = [
  { stockRef: 'OF-101', kind: 'conversion', title: 'Coolant pump relay chatters at idle', detail: 'Audible from the driver\'s seat with the motor at rest; relay under the bonnet, nearside.', priority: 'normal', status: 'open', blocking: false, assignee: 'lead@voltwright.test' },
  { stockRef: 'OF-101', kind: 'remedial', title: 'Sill rust behind the nearside jacking point', detail: 'Found with the car on the lift; about 40 mm, not structural yet.', priority: 'high', status: 'in-hand', blocking: false, assignee: 'engineer@voltwright.test' },
  { stockRef: 'OF-101', kind: 'enhancement', title: 'Offer a heated windscreen', detail: 'Owner drives in winter mornings; the pack has the capacity.', priority: 'low', status: 'open', blocking: false, assignee: null },
  { stockRef: 'OF-104', kind: 'conversion', title: 'Lift-off regen abrupt on the wet roundabout', detail: 'Road test on a wet road: firm step at lift-off. Version 2 with 15 % is in review.', priority: 'high', status: 'open', blocking: false, assignee: 'tuner@voltwright.test' },
  { stockRef: 'OF-104', kind: 'remedial', title: 'Offside front caliper drags', detail: 'Wheel warm after the test drive; slider pins need cleaning.', priority: 'urgent', status: 'in-hand', blocking: false, assignee: 'engineer@voltwright.test' },
  { stockRef: 'OF-104', kind: 'enhancement', title: 'Offer a cabin pre-heat timer', detail: 'Warms the cabin on mains power before a winter run.', priority: 'low', status: 'open', blocking: false, assignee: null },
  { stockRef: 'OF-103', kind: 'enhancement', title: 'Offer a second charging cable', detail: 'Type 2 to domestic plug, for the owner\'s weekend cottage.', priority: 'low', status: 'open', blocking: false, assignee: null },
  { stockRef: 'OF-103', kind: 'remedial', title: 'Wiper motor slow on the second speed', detail: 'Brushes replaced.', priority: 'normal', status: 'done', blocking: false, assignee: 'engineer@voltwright.test' },
  { stockRef: 'OF-106', kind: 'conversion', title: 'HV loom chafing at the bulkhead grommet', detail: 'Must be sleeved before any road test.', priority: 'urgent', status: 'open', blocking: true, assignee: 'lead@voltwright.test' }
]
