import net from 'node:net';

/**
 * A TCP pass-through to a target that the test can cut (every open connection dropped, new ones refused) and
 * restore: a database outage and its recovery without stopping the shared test PostgreSQL.
 */
export async function startTcpSwitch(target: { host: string; port: number }) {
  const sockets = new Set<net.Socket>();
  let up = true;
  const server = net.createServer((client) => {
    if (!up) return void client.destroy();
    const upstream = net.connect(target.port, target.host);
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on('close', () => sockets.delete(s));
      s.on('error', () => undefined);
    }
    client.pipe(upstream).pipe(client);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as net.AddressInfo;
  return {
    port,
    /** Drops every connection and refuses new ones. */
    cut() {
      up = false;
      for (const s of sockets) s.destroy();
    },
    restore() {
      up = true;
    },
    close: () => new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      server.close(() => resolve());
    }),
  };
}
