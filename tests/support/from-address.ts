import http from 'node:http';

// Requests from a chosen loopback source address: with no proxy declared the app's client address
// is the socket's, so tests tell clients apart this way (Linux routes all of 127.0.0.0/8 to lo).
export function fromAddress(
  localAddress: string,
  path: string,
  opts: { method?: string; headers?: Record<string, string>; body?: string; port?: number } = {},
) {
  return new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: string }>((resolve, reject) => {
    const req = http.request(
      {
        host: '127.0.0.1',
        port: opts.port ?? Number(process.env.PORT ?? 3100),
        path,
        method: opts.method ?? 'GET',
        headers: opts.headers,
        localAddress,
      },
      (res) => {
        let body = '';
        res.setEncoding('utf8');
        res.on('data', (c) => (body += c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
      },
    );
    req.on('error', reject);
    req.end(opts.body);
  });
}

/** A random loopback address other than 127.0.0.1, so one test's counter never meets another's. */
export const randomLoopback = () =>
  `127.${1 + Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}.${1 + Math.floor(Math.random() * 250)}`;
