// An HTTP load generator for the benchmarks, run on a worker thread so that it never shares an
// event loop with the server it measures. `connections` keep-alive connections send GET
// requests for `durationMs`: back to back (closed loop, the server's most), or, with `rate`,
// on a fixed schedule adding up to `rate` requests a second. On a schedule, latency counts from
// when a request was due, not when it went out, so a server that falls behind is charged for it.
import http from 'node:http';
import { parentPort, workerData } from 'node:worker_threads';

const { url, connections, durationMs, headers, rate } = workerData;
const agent = new http.Agent({ keepAlive: true, maxSockets: connections });
const latencies = [];
let errors = 0;
let bytes = 0;

function once(due = performance.now()) {
  return new Promise((resolve) => {
    const started = due;
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
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
async function loop(_, index) {
  if (!rate) {
    while (performance.now() < warmUntil) await once();
    latencies.length = 0;
    while (performance.now() < end) await once();
    return;
  }
  const every = (1000 * connections) / rate;
  let due = performance.now() + (every * index) / connections;
  let warm = true;
  while (due < end) {
    const wait = due - performance.now();
    if (wait > 0) await sleep(wait);
    if (warm && due >= warmUntil) {
      warm = false;
      if (index === 0) latencies.length = 0;
    }
    await once(due);
    due += every;
  }
}
const t0 = performance.now();
await Promise.all(Array.from({ length: connections }, (_, i) => loop(_, i)));
const seconds = (performance.now() - Math.max(t0, warmUntil)) / 1000;
latencies.sort((a, b) => a - b);
const at = (q) => latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? NaN;
agent.destroy();
parentPort.postMessage({ requests: latencies.length, errors, rps: latencies.length / seconds, p50: at(0.5), p99: at(0.99), bytes });
