import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { requireJsonBody, sameOrigin } from './same-origin';

function app() {
  const a = express();
  a.use(sameOrigin('https://stillspan.example'));
  a.all('/x', (_req, res) => {
    res.json({ ok: true });
  });
  return a;
}

describe('sameOrigin', () => {
  it('lets reads through from anywhere', async () => {
    await request(app()).get('/x').set('Origin', 'https://other.example').expect(200);
  });

  it('lets a state change through without Origin, from APP_URL, or from the host the request came to', async () => {
    await request(app()).post('/x').expect(200);
    await request(app()).post('/x').set('Origin', 'https://stillspan.example').expect(200);
    await request(app()).patch('/x').set('Host', 'localhost:5173').set('Origin', 'http://localhost:5173').expect(200);
  });

  it('refuses a state change from another site, from "null" and from a look-alike host', async () => {
    for (const origin of ['https://other.example', 'null', 'https://stillspan.example.other.example', 'http://stillspan.example:444']) {
      const response = await request(app()).delete('/x').set('Origin', origin);
      expect(response.status, origin).toBe(403);
      expect(response.body.error.code).toBe('cross_origin');
    }
  });
});

describe('requireJsonBody', () => {
  function jsonApp() {
    const a = express();
    a.use('/api', requireJsonBody);
    a.all('/api/{*rest}', (_req, res) => {
      res.json({ ok: true });
    });
    return a;
  }

  it('lets multipart through only for the upload of a site record', async () => {
    await request(jsonApp()).post('/api/projects/p1/site-records').field('a', 'b').expect(200);
    await request(jsonApp()).post('/api/projects/p1/structures').field('a', 'b').expect(415);
    await request(jsonApp()).post('/api/projects/p1/site-records/r1/analyse').field('a', 'b').expect(415);
    await request(jsonApp()).patch('/api/projects/p1/site-records').field('a', 'b').expect(415);
    await request(jsonApp()).post('/api/projects/p1/site-records').set('Content-Type', 'text/plain').send('x').expect(415);
  });
});
