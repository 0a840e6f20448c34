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

// Each snag raised on its day (days before the seed run, at a workshop hour): the Morrow's two during its road
// test, before it was signed off; the Tregarth's cable at its handover.
export const demoSnags = [
  { stockRef: 'OF-101', daysAgo: 8, time: '11:00', kind: 'conversion', title: 'Coolant pump relay chatters at idle', detail: 'Audible from the driver\'s seat with the motor at rest; relay under the bonnet, nearside.', priority: 'normal', status: 'open', blocking: false, assignee: 'lead@voltwright.test' },
  { stockRef: 'OF-101', daysAgo: 25, time: '10:00', kind: 'remedial', title: 'Sill rust behind the nearside jacking point', detail: 'Found with the car on the lift; about 40 mm, not structural yet.', priority: 'high', status: 'in-hand', blocking: false, assignee: 'engineer@voltwright.test' },
  { stockRef: 'OF-101', daysAgo: 5, time: '16:30', kind: 'enhancement', title: 'Offer a heated windscreen', detail: 'Owner drives in winter mornings; the pack has the capacity.', priority: 'low', status: 'open', blocking: false, assignee: null },
  { stockRef: 'OF-104', daysAgo: 19, time: '15:00', kind: 'conversion', title: 'Lift-off regen abrupt on the wet roundabout', detail: 'Road test on a wet road: firm step at lift-off. The next version should bring lift-off regen down.', priority: 'high', status: 'open', blocking: false, assignee: 'tuner@voltwright.test' },
  { stockRef: 'OF-104', daysAgo: 19, time: '15:10', kind: 'remedial', title: 'Offside front caliper drags', detail: 'Wheel warm after the test drive; slider pins need cleaning.', priority: 'urgent', status: 'in-hand', blocking: false, assignee: 'engineer@voltwright.test' },
  { stockRef: 'OF-104', daysAgo: 10, time: '12:00', kind: 'enhancement', title: 'Offer a cabin pre-heat timer', detail: 'Warms the cabin on mains power before a winter run.', priority: 'low', status: 'open', blocking: false, assignee: null },
  { stockRef: 'OF-103', daysAgo: 55, time: '10:30', kind: 'enhancement', title: 'Offer a second charging cable', detail: 'Type 2 to domestic plug, for the owner\'s weekend cottage.', priority: 'low', status: 'open', blocking: false, assignee: null },
  { stockRef: 'OF-103', daysAgo: 70, time: '14:00', kind: 'remedial', title: 'Wiper motor slow on the second speed', detail: 'Brushes replaced.', priority: 'normal', status: 'done', blocking: false, assignee: 'engineer@voltwright.test' },
  { stockRef: 'OF-106', daysAgo: 12, time: '09:45', kind: 'conversion', title: 'HV loom chafing at the bulkhead grommet', detail: 'Must be sleeved before any road test.', priority: 'urgent', status: 'open', blocking: true, assignee: 'lead@voltwright.test' }
]
