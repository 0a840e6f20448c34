// Median time of one full evaluation, curves included, for a typical car: the tune sheet re-runs it
// on every keystroke, so it must stay under 2 ms. Run: npx tsx scripts/bench-evaluate.ts
import { Bench } from 'tinybench'
import { evaluate } from '../shared/compute/evaluate'
import { exampleSpec } from '../shared/compute/example'
import { defaultParameters, marrick110 } from '../shared/platforms/index'

const BUDGET_MS = 2
const parameters = defaultParameters(marrick110)

const bench = new Bench({ time: 2000, warmupTime: 500 })
bench.add('evaluate (example car, Marrick 110 defaults)', () => {
  evaluate(exampleSpec, marrick110, parameters)
})
await bench.run()

const result = bench.tasks[0]?.result
if (!result || !('latency' in result)) throw new Error('The benchmark did not complete')
const median = result.latency.p50
console.log(`evaluate: median ${median.toFixed(3)} ms over ${result.latency.samplesCount} runs (budget ${BUDGET_MS} ms)`)
if (median >= BUDGET_MS) {
  console.error('Over budget: make the evaluation faster before shipping.')
  process.exitCode = 1
}
