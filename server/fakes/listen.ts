import type { Server } from 'node:net';

/** Listens on host:port (0 for any free port); rejects when the port is taken. */
export function listenOn(server: Server, port: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const failed = (error: NodeJS.ErrnoException) => {
      reject(error.code === 'EADDRINUSE' ? new Error(`port ${host}:${port} is already in use (is another Tidefield running?)`) : error);
    };
    server.once('error', failed);
    server.listen(port, host, () => {
      server.off('error', failed);
      resolve();
    });
  });
}
