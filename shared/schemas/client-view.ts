// A car as its owner sees it: no people, notes or evaluations; open faults by title and priority only.
export interface ClientCarView {
  car: { id: number, stockRef: string, make: string, model: string, year: number, registration: string, status: string, statusLabel: string }
  onCar: { profile: string, versionNo: number, words: string[] }[]
  roadTest: { testedAt: string, verdict: 'pass' | 'fail', surface: string } | null
  enhancements: { id: number, title: string, detail: string, status: string }[]
  // Faults and repairs still open, by title and priority only, with what that means for driving the car.
  openWork: { id: number, title: string, priority: string }[]
  openWorkAdvice: string
  handoverPdf: string
  // Set when the controller was last read and did not hold the signed-off settings.
  drift: { since: string } | null
}
