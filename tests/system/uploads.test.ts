import { describe, it, expect, afterAll } from 'vitest';
import { baseUrl } from '../support/browser';
import { closeTestDb, sessionFor } from '../support/db';

afterAll(async () => {
  await closeTestDb();
});

const as = async (userId: string) => ({ cookie: `wallpulse_session=${await sessionFor(userId)}`, 'content-type': 'application/json' });
const day = (base: number) => Array.from({ length: 48 }, (_, h) => base + 5 * Math.sin((2 * Math.PI * h) / 24));
const body = (over: Record<string, unknown> = {}) => ({
  name: 'Harrow Lane roof sensor, July',
  fileName: 'harrow-roof-july.csv',
  mapping: { timeColumn: 0, temperatureColumn: 1, irradianceColumn: null, temperatureUnit: 'C' },
  series: { step: 3600, air: day(18) },
  ...over,
});

describe('POST /api/uploads', () => {
  it('keeps an hourly series for an engineer and answers 201 with its summary', async () => {
    const res = await fetch(`${baseUrl()}/api/uploads`, { method: 'POST', headers: await as('demo-engineer'), body: JSON.stringify(body()) });
    expect(res.status).toBe(201);
    const { upload } = await res.json();
    expect(upload).toMatchObject({ name: 'Harrow Lane roof sensor, July', fileName: 'harrow-roof-july.csv', rowCount: 48, hasIrradiance: false });
  });

  it('refuses a checker with 403: only engineers and admins create uploads', async () => {
    const res = await fetch(`${baseUrl()}/api/uploads`, { method: 'POST', headers: await as('demo-checker'), body: JSON.stringify(body()) });
    expect(res.status).toBe(403);
    expect((await res.json()).error.code).toBe('forbidden');
  });

  it('answers 422 naming the field for a temperature out of range and an irradiance column of the wrong length', async () => {
    const air = day(18);
    air[5] = 95;
    const res = await fetch(`${baseUrl()}/api/uploads`, { method: 'POST', headers: await as('demo-engineer'), body: JSON.stringify(body({ series: { step: 3600, air, irradiance: [0, 1] } })) });
    expect(res.status).toBe(422);
    const { error } = await res.json();
    expect(error.fields['series.air[5]']).toBe('must be between -80 and 70 °C');
    expect(error.fields['series.irradiance']).toBe('must hold as many values as air');
  });

  it('answers 401 when signed out', async () => {
    const res = await fetch(`${baseUrl()}/api/uploads`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body()) });
    expect(res.status).toBe(401);
  });
});

describe('GET /api/uploads', () => {
  it('lists the team uploads without their series to any member, and gives one with its series', async () => {
    const made = await fetch(`${baseUrl()}/api/uploads`, { method: 'POST', headers: await as('demo-admin'), body: JSON.stringify(body({ name: 'Listed series' })) });
    const { upload } = await made.json();
    const list = await fetch(`${baseUrl()}/api/uploads`, { headers: await as('demo-checker') });
    expect(list.status).toBe(200);
    const { uploads } = await list.json();
    const row = uploads.find((u: { id: number }) => u.id === upload.id);
    expect(row).toMatchObject({ name: 'Listed series', rowCount: 48 });
    expect(row.series).toBeUndefined();
    const one = await fetch(`${baseUrl()}/api/uploads/${upload.id}`, { headers: await as('demo-checker') });
    expect(one.status).toBe(200);
    const got = (await one.json()).upload;
    expect(got.series.air).toHaveLength(48);
    expect(got.series.air[0]).toBeCloseTo(18, 12);
  });

  it('answers 404 for an upload that does not exist', async () => {
    const res = await fetch(`${baseUrl()}/api/uploads/987654`, { headers: await as('demo-engineer') });
    expect(res.status).toBe(404);
  });
});
