import { Writable } from 'node:stream';
import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { createLogger } from '../bootstrap.js';
import { HttpError } from '../http/errors.js';
import { createErrorHandler } from './error-handler.js';

/** An app whose routes fail on purpose, logging into an array of parsed lines. */
function failingApp() {
  const lines: Array<Record<string, any>> = [];
  const sink = new Writable({ write: (chunk, _enc, done) => (lines.push(JSON.parse(chunk.toString())), done()) });
  const app = express();
  app.get('/api/invitations/:token', () => {
    const err = Object.assign(new Error('the mail queue refused the message'), { detail: { password: 'hunter2-secret', apiKey: 'sk_live_secret' } });
    throw err;
  });
  app.get('/api/missing', () => {
    throw new HttpError(404, 'not_found', 'No such project.');
  });
  app.use(createErrorHandler(createLogger('info', sink)));
  return { app, lines };
}

describe('createErrorHandler', () => {
  it('answers a 500 without internals and logs the error through the redacting logger', async () => {
    const { app, lines } = failingApp();
    const res = await request(app).get('/api/invitations/TOKEN-abc123?token=second-secret');
    expect(res.status).toBe(500);
    expect(res.body.error.code).toBe('internal');
    expect(JSON.stringify(res.body)).not.toContain('mail queue');
    const text = JSON.stringify(lines);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatchObject({ level: 50, msg: 'request failed', req: { method: 'GET', url: '/api/invitations/[redacted]?token=[redacted]' } });
    expect(lines[0].err.message).toBe('the mail queue refused the message');
    expect(lines[0].err.detail).toEqual({ password: '[redacted]', apiKey: '[redacted]' });
    for (const secret of ['hunter2-secret', 'sk_live_secret', 'TOKEN-abc123', 'second-secret']) expect(text).not.toContain(secret);
  });

  it('keeps a refusal’s status and code, and logs it at info level with the code', async () => {
    const { app, lines } = failingApp();
    const res = await request(app).get('/api/missing');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({ error: { code: 'not_found', message: 'No such project.' } });
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatchObject({ level: 30, msg: 'request refused', code: 'not_found', status: 404 });
  });
});
