/**
 * Load benchmark of a whole drill (the runner is tests/support/load.ts): BENCH_LOAD_SOCKETS (500) members,
 * BENCH_LOAD_EXTRA_INJECTS, BENCH_LOAD_SECONDS of wall time, BENCH_LOAD_CLIENTS client processes,
 * BENCH_LOAD_PROBES probe sockets. Build first (npm run build). Run: node --import tsx scripts/bench/load.ts
 */
import { formatLoadReport, runLoad } from '../../tests/support/load'

const report = await runLoad({
  sockets: Number(process.env.BENCH_LOAD_SOCKETS) || 500,
  extraInjects: Number(process.env.BENCH_LOAD_EXTRA_INJECTS) || 16,
  wallSeconds: Number(process.env.BENCH_LOAD_SECONDS) || 60,
  clientProcesses: Number(process.env.BENCH_LOAD_CLIENTS ?? 3),
  probes: Number(process.env.BENCH_LOAD_PROBES ?? 20),
  log: line => console.log(`  ${line}`),
})
console.log(formatLoadReport(report))
const ok = report.lost === 0 && report.duplicateResponses === 0 && report.duplicateDeliveries === 0 && report.errors.length === 0
const met = (yes: boolean) => (yes ? 'met' : 'MISSED')
console.log(`targets: p99 delivery < 150 ms ${met(report.delivery.p99Ms < 150)}; nothing lost ${met(report.lost === 0)}; `
  + `no duplicate response ${met(report.duplicateResponses === 0)}`)
process.exit(ok ? 0 : 1)
