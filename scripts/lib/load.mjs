// One autocannon run with every response's latency kept, so p95 can be taken (autocannon reports no p95).
import autocannon from 'autocannon'

export function percentile(sorted, p) {
  if (!sorted.length) return null
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))
  return sorted[i]
}

export async function measure({ url, method = 'GET', headers = {}, body, connections = 32, duration = 10 }) {
  const latencies = []
  let non2xx = 0
  const instance = autocannon({ url, method, headers, body, connections, duration })
  instance.on('response', (_client, statusCode, _bytes, ms) => {
    latencies.push(ms)
    if (statusCode < 200 || statusCode >= 300) non2xx++
  })
  const result = await new Promise((resolve, reject) => instance.once('done', resolve).once('error', reject))
  latencies.sort((a, b) => a - b)
  return {
    requests: latencies.length,
    reqPerSec: result.requests.average,
    p50: percentile(latencies, 50),
    p95: percentile(latencies, 95),
    p99: percentile(latencies, 99),
    non2xx,
    errors: result.errors + result.timeouts
  }
}
