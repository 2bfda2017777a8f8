import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { readDemoConfig } from '../demo-config.js';
import { createReadingPoster } from '../reading-poster.js';

/** A local stand-in for the ingest route: answers with the statuses it is given, in turn, and records the posts. */
async function standIn(statuses: number[]) {
  const posts: { url: string; auth: string | undefined; readings: unknown[] }[] = [];
  const server = http.createServer((req, res) => {
    let body = '';
    req.on('data', (chunk) => (body += chunk));
    req.on('end', () => {
      const status = statuses.shift() ?? 200;
      const readings = (JSON.parse(body) as { readings: unknown[] }).readings;
      if (status === 200) posts.push({ url: req.url ?? '', auth: req.headers.authorization, readings });
      res.writeHead(status, { 'content-type': 'application/json' });
      res.end(
        JSON.stringify(
          status === 200
            ? { accepted: readings.length, duplicates: 0, rejected: [] }
            : { error: { code: 'x', message: 'not yet' } },
        ),
      );
    });
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { posts, server, url: `http://127.0.0.1:${(server.address() as AddressInfo).port}` };
}

let close: (() => void) | undefined;
afterEach(() => close?.());
const reading = (i: number) => ({ t: new Date(1_800_000_000_000 + i * 1000).toISOString(), u: [i], y: [i] });

describe('posting readings', () => {
  it('sends queued readings with the ingest token, and keeps them through failures with growing back-off', async () => {
    const api = await standIn([503, 503]);
    close = () => api.server.close();
    const log: string[] = [];
    let clock = 0;
    const poster = createReadingPoster({
      apiUrl: api.url,
      token: 'sli_demo',
      log: (l) => log.push(l),
      now: () => clock,
    });
    poster.enqueue('loop-a', reading(1));
    await poster.flush();
    expect(poster.retryInMs()).toBe(1000);
    poster.enqueue('loop-a', reading(2));
    await poster.flush(); // still backing off: nothing is sent
    expect(poster.queued()).toBe(2);
    clock = 1000;
    await poster.flush();
    expect(poster.retryInMs()).toBe(2000); // doubled
    clock = 3000;
    await poster.flush();
    expect(poster.queued()).toBe(0);
    expect(api.posts).toEqual([
      { url: '/api/v1/loops/loop-a/readings', auth: 'Bearer sli_demo', readings: [reading(1), reading(2)] },
    ]);
    expect(log.at(0)).toMatch(/503 not yet, 1×/);
    expect(log.at(-1)).toMatch(/again after 2 failed attempts/);
  });

  it('drops the oldest readings beyond the queue limit while the api is away', () => {
    const poster = createReadingPoster({
      apiUrl: 'http://127.0.0.1:9',
      token: 't',
      log: () => undefined,
      maxQueued: 3,
    });
    for (let i = 0; i < 5; i++) poster.enqueue('loop-a', reading(i));
    expect(poster.queued()).toBe(3);
  });
});

describe('demo plant settings', () => {
  it('needs the database, the api and the token, and checks DEMO_SPEED', () => {
    expect(() => readDemoConfig({ DEMO_SPEED: '0' })).toThrow(
      /DATABASE_URL is required.*API_URL is required.*DEMO_PLANT_TOKEN is required.*DEMO_SPEED must be a number above 0/,
    );
    const config = readDemoConfig({
      DATABASE_URL: 'postgres://x',
      API_URL: 'http://127.0.0.1:4600/',
      DEMO_PLANT_TOKEN: 'sli_x',
    });
    expect(config).toMatchObject({ apiUrl: 'http://127.0.0.1:4600', speed: 1, seed: 7 });
  });
});
