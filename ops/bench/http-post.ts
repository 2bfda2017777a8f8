import http from 'node:http';

/**
 * POSTs JSON over a small pool of kept-alive loopback connections; resolves with status and body.
 * A post that meets a reset on a reused connection (the server closed it as idle just as the post
 * went out) is sent once more on a fresh one, as Node's documentation advises: readings posts are
 * idempotent, a slot already stored counts as a duplicate.
 */
export function createPoster(baseUrl: string, token: string, maxSockets = 16) {
  const agent = new http.Agent({ keepAlive: true, maxSockets });
  const { hostname, port } = new URL(baseUrl);
  function send(path: string, body: string, retried: boolean): Promise<{ status: number; text: string }> {
    return new Promise((resolve, reject) => {
      const request = http.request(
        {
          agent,
          hostname,
          port,
          path,
          method: 'POST',
          headers: {
            authorization: `Bearer ${token}`,
            'content-type': 'application/json',
            'content-length': Buffer.byteLength(body),
          },
        },
        (response) => {
          const chunks: Buffer[] = [];
          response.on('data', (chunk: Buffer) => chunks.push(chunk));
          response.on('end', () =>
            resolve({ status: response.statusCode ?? 0, text: Buffer.concat(chunks).toString('utf8') }),
          );
          response.on('error', reject);
        },
      );
      request.on('error', (error: NodeJS.ErrnoException) => {
        const closedUnderUs = request.reusedSocket && (error.code === 'ECONNRESET' || error.code === 'EPIPE');
        if (closedUnderUs && !retried) send(path, body, true).then(resolve, reject);
        else reject(error);
      });
      request.end(body);
    });
  }
  return { post: (path: string, body: string) => send(path, body, false), close: () => agent.destroy() };
}

/** One readings body: `count` readings of loop slots fromK…, one input and one output each. */
export function readingsBody(fromK: number, count: number, samplePeriodS = 1): string {
  const parts: string[] = [];
  for (let i = 0; i < count; i++) {
    const k = fromK + i;
    parts.push(
      `{"t":"${new Date(k * samplePeriodS * 1000).toISOString()}","u":[${(k % 100) / 10}],"y":[${0.5 + (k % 7) / 100}]}`,
    );
  }
  return `{"readings":[${parts.join(',')}]}`;
}
