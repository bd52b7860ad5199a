// A closed-loop HTTP load generator for the benchmarks, run on a worker thread so that it
// never shares an event loop with the server it measures. `connections` keep-alive
// connections each send GET requests back to back for `durationMs`.
import http from 'node:http';
import { parentPort, workerData } from 'node:worker_threads';

const { url, connections, durationMs, headers } = workerData;
const agent = new http.Agent({ keepAlive: true, maxSockets: connections });
const latencies = [];
let errors = 0;
let bytes = 0;

function once() {
  return new Promise((resolve) => {
    const started = performance.now();
    const req = http.get(url, { agent, headers }, (res) => {
      res.on('data', (chunk) => (bytes += chunk.length));
      res.on('end', () => {
        if (res.statusCode !== 200) errors++;
        latencies.push(performance.now() - started);
        resolve();
      });
    });
    req.on('error', () => {
      errors++;
      resolve();
    });
  });
}

const warmUntil = performance.now() + Math.min(1000, durationMs / 5);
const end = warmUntil + durationMs;
async function loop() {
  while (performance.now() < warmUntil) await once();
  latencies.length = 0;
  while (performance.now() < end) await once();
}
const t0 = performance.now();
await Promise.all(Array.from({ length: connections }, loop));
const seconds = (performance.now() - Math.max(t0, warmUntil)) / 1000;
latencies.sort((a, b) => a - b);
const at = (q) => latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? NaN;
agent.destroy();
parentPort.postMessage({ requests: latencies.length, errors, rps: latencies.length / seconds, p50: at(0.5), p99: at(0.99), bytes });
