import { spawn, type ChildProcess } from 'node:child_process';
import http from 'node:http';
import net, { type AddressInfo } from 'node:net';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../..');

/** A port nobody listens on just now (taken by the OS, then released for the child to bind). */
async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  await new Promise((resolve) => server.close(resolve));
  return port;
}

export type ApiCopy = { port: number; child: ChildProcess; output: () => string };

// Every child started and not yet stopped, so a failed start-up of one copy cannot leave the other running.
const running = new Set<ChildProcess>();

/** Starts one real API process (server/cli/serve.ts, no preparation) and waits until GET /api/health answers 200. */
export async function startApiCopy(env: Record<string, string>, timeoutMs: number): Promise<ApiCopy> {
  const port = await freePort();
  const child = spawn(path.join(ROOT, 'node_modules/.bin/tsx'), [path.join(ROOT, 'server/cli/serve.ts')], {
    cwd: ROOT,
    env: { ...process.env, ...env, HOST: '127.0.0.1', PORT: String(port) },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  running.add(child);
  child.once('exit', () => running.delete(child));
  let output = '';
  child.stdout!.on('data', (d) => (output += d));
  child.stderr!.on('data', (d) => (output += d));
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`API copy exited with ${child.exitCode}:\n${output}`);
    const ok = await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.ok, () => false);
    if (ok) return { port, child, output: () => output };
    if (Date.now() > deadline) {
      child.kill('SIGKILL');
      throw new Error(`API copy on port ${port} not ready after ${timeoutMs} ms:\n${output}`);
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

/** Stops every copy started here: SIGTERM (each closes its pool), SIGKILL for any not gone within three seconds. */
export async function stopApiCopies(): Promise<void> {
  await Promise.all(
    [...running].map(async (child) => {
      if (child.exitCode !== null || child.signalCode !== null) return;
      const gone = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), 3000);
      await gone;
      clearTimeout(timer);
    }),
  );
}

export type RoundRobin = { url: string; close: () => Promise<void> };

/**
 * The one address in front of several copies, as a load balancer: each request goes to the next copy in turn, with
 * X-Forwarded-For extended by the client's address; the answer carries `x-upstream` (the copy's index) for the tests.
 */
export async function roundRobinProxy(ports: number[]): Promise<RoundRobin> {
  let next = 0;
  const server = http.createServer((req, res) => {
    const index = next++ % ports.length;
    const forwarded = [req.headers['x-forwarded-for'], req.socket.remoteAddress].filter(Boolean).join(', ');
    const upstream = http.request(
      { host: '127.0.0.1', port: ports[index], method: req.method, path: req.url, headers: { ...req.headers, 'x-forwarded-for': forwarded }, agent: false },
      (answer) => {
        res.writeHead(answer.statusCode ?? 502, { ...answer.headers, 'x-upstream': String(index) });
        answer.pipe(res);
      },
    );
    upstream.on('error', () => {
      if (!res.headersSent) res.writeHead(502);
      res.end();
    });
    req.pipe(upstream);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    url: `http://127.0.0.1:${(server.address() as AddressInfo).port}`,
    close: () => new Promise((resolve) => { server.closeAllConnections(); server.close(() => resolve()); }),
  };
}
