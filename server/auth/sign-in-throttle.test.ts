import express from 'express';
import request from 'supertest';
import { describe, it } from 'vitest';
import { signInThrottle } from './sign-in-throttle';

/** A stand-in for the sign-in endpoint: sets a session cookie for the password "right". */
function app(now: () => number) {
  const a = express();
  a.use('/signin', ...signInThrottle({ maxFailures: 3, windowMs: 60_000, now }));
  a.post('/signin', (req, res) => {
    if ((req.body as { password?: string }).password === 'right') res.cookie('authjs.session-token', 'token');
    res.status(302).location('/').end();
  });
  return a;
}

describe('signInThrottle', () => {
  it('refuses an address after the allowed failures until the window has passed', async () => {
    let t = 1_000_000;
    const server = app(() => t);
    for (let i = 0; i < 3; i += 1) await request(server).post('/signin').type('form').send({ email: 'a@x.test', password: 'wrong' }).expect(302);
    await request(server).post('/signin').type('form').send({ email: 'A@x.test ', password: 'right' }).expect(429);
    await request(server).post('/signin').type('form').send({ email: 'b@x.test', password: 'right' }).expect(302);
    t += 60_001;
    await request(server).post('/signin').type('form').send({ email: 'a@x.test', password: 'right' }).expect(302);
  });

  it('a successful sign-in clears the count', async () => {
    const server = app(() => 5);
    for (let i = 0; i < 2; i += 1) await request(server).post('/signin').type('form').send({ email: 'c@x.test', password: 'wrong' });
    await request(server).post('/signin').type('form').send({ email: 'c@x.test', password: 'right' }).expect(302);
    for (let i = 0; i < 2; i += 1) await request(server).post('/signin').type('form').send({ email: 'c@x.test', password: 'wrong' }).expect(302);
    await request(server).post('/signin').type('form').send({ email: 'c@x.test', password: 'right' }).expect(302);
  });
});
