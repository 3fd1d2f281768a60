/**
 * A round-robin reverse proxy for the plan benchmark, run as a child process so it shares an event
 * loop with neither the load generator nor the servers: `tsx round-robin-proxy.ts <target>…`.
 * Built on http-proxy: each request goes to the next target in turn, headers (the session cookie)
 * passed as they are, upstream connections kept alive in one agent (without an agent http-proxy
 * asks every upstream connection to close). Prints `READY <port>` when listening and, on SIGTERM,
 * `SERVED <n>…` (requests sent to each target, in order) before it exits.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import httpProxy from 'http-proxy';

const targets = process.argv.slice(2);
if (targets.length === 0) throw new Error('round-robin-proxy: no targets');

const agent = new http.Agent({ keepAlive: true, maxSockets: 512 });
const proxy = httpProxy.createProxyServer({ agent });
const served = targets.map(() => 0);
let next = 0;

proxy.on('error', (_err, _req, res) => {
  // a web request's answer is a ServerResponse; an upgrade's a socket (none here)
  if (!(res instanceof http.ServerResponse)) {
    res.destroy();
    return;
  }
  if (!res.headersSent) res.writeHead(502, { 'Content-Type': 'text/plain' });
  res.end('bad gateway');
});

const server = http.createServer((req, res) => {
  const at = next;
  next = (next + 1) % targets.length;
  served[at]! += 1;
  proxy.web(req, res, { target: targets[at] });
});
// longer than autocannon's pauses between requests, so client connections stay open
server.keepAliveTimeout = 30_000;

server.listen(0, '127.0.0.1', () => {
  console.log(`READY ${(server.address() as AddressInfo).port}`);
});
process.on('SIGTERM', () => {
  console.log(`SERVED ${served.join(' ')}`);
  server.closeAllConnections();
  server.close(() => {
    agent.destroy();
    process.exit(0);
  });
});
