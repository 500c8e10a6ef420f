// `npm run load` helper: probes GET <url>/healthz every <everyMs> in its own process (so the load client's
// work does not delay the probe) until its standard input closes, then prints the latencies [ms] and the
// failures as one JSON line.
const [url, everyMs = '25'] = process.argv.slice(2)
const ms = []
let failed = 0
let running = true
process.stdin.on('end', () => {
  running = false
})
process.stdin.resume()
while (running) {
  const t0 = performance.now()
  try {
    const res = await fetch(`${url}/healthz`)
    await res.arrayBuffer()
    if (res.status === 200) ms.push(performance.now() - t0)
    else failed++
  } catch {
    failed++
  }
  await new Promise((r) => setTimeout(r, Number(everyMs)))
}
process.stdout.write(`${JSON.stringify({ ms, failed })}\n`)
