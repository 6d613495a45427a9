import net from 'node:net';

/** A loopback TCP relay that a test can cut and restore, to make a dependency (PostgreSQL, SMTP) unreachable. */
export function tcpRelay(targetPort: number) {
  const sockets = new Set<net.Socket>();
  let server: net.Server | null = null;
  let port = 0;
  const open = (fixedPort?: number) => new Promise<number>((resolve, reject) => {
    server = net.createServer((client) => {
      const upstream = net.connect(targetPort, '127.0.0.1');
      for (const s of [client, upstream]) { sockets.add(s); s.on('close', () => sockets.delete(s)); s.on('error', () => s.destroy()); }
      client.pipe(upstream).pipe(client);
    });
    server.once('error', reject);
    server.listen(fixedPort ?? port, '127.0.0.1', () => { port = (server!.address() as net.AddressInfo).port; resolve(port); });
  });
  const cut = () => new Promise<void>((resolve) => {
    for (const s of sockets) s.destroy();
    if (!server) return resolve();
    server.close(() => resolve());
  });
  return { open, cut, get port() { return port; } };
}
