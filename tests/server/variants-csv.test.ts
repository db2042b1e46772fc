// The library's CSV: export format, all-or-nothing import with row errors, upload limits, and the
// round trip export → import into a fresh team gives back the same library (a property over random libraries).
import { beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import Papa from 'papaparse';
import seedrandom from 'seedrandom';
import type request from 'supertest';
import { JOINTS } from '../../shared/engine/types';
import { LIBRARY_CSV_COLUMNS, nameKey, variantBody, type VariantBody } from '../../shared/schemas';
import { buildLibraryCsv } from '../../server/modules/variants/variants.csv';
import { DEMO_LIBRARY } from '../../server/db/seed/demo-library';
import { useTestApp } from '../support/app';
import { createPlanEntry, createTeam, createVariant, type TestTeam } from '../support/factories';

const t = useTestApp();
let team: TestTeam;
let coach: request.Agent;

const HEADER = LIBRARY_CSV_COLUMNS.join(',');

function upload(agent: request.Agent, text: string | Buffer, filename = 'library.csv') {
  return agent.post('/api/variants/import').attach('file', Buffer.isBuffer(text) ? text : Buffer.from(text), filename);
}

async function exportOf(agent: request.Agent): Promise<string> {
  const res = await agent.get('/api/variants/export');
  expect(res.status).toBe(200);
  return res.text;
}

/** The file's records, order aside: the export lists by name as the database sorts, the generator does not. */
function recordsOf(csv: string): string[] {
  const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  const [header, ...rows] = parsed.data;
  expect(header).toEqual([...LIBRARY_CSV_COLUMNS]);
  return rows.map((r) => JSON.stringify(r)).sort();
}

async function freshCoach() {
  const fresh = await createTeam(t.ctx.database.db);
  return { fresh, agent: await t.signIn(fresh.headCoach.email) };
}

beforeAll(async () => {
  const db = t.ctx.database.db;
  team = await createTeam(db);
  await createVariant(db, team.teamId, {
    name: 'Box squat, parallel box',
    family: 'box squat',
    equipment: ['box', 'bands'],
    stress: { lowerBack: 2, hip: 2, knee: 1 },
    risk: 2,
    specificity: 0.6,
    notes: 'Sit back, "pause", drive.\nKeep the shins vertical.',
  });
  const used = await createVariant(db, team.teamId, {
    name: 'Rack pull, below knee',
    lift: 'deadlift',
    family: 'rack pull',
  });
  await createPlanEntry(db, team.teamId, team.athleteId, used);
  coach = await t.signIn(team.coach.email);
  // Archived (it is in the history), so the export must carry the flag.
  expect((await coach.delete(`/api/variants/${used}`)).body.result).toBe('archived');
});

describe('GET /api/variants/export', () => {
  it('sends CSV with our column names, one row per variant, archived ones flagged', async () => {
    const res = await coach.get('/api/variants/export');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="rackturn-library-\d{4}-\d{2}-\d{2}\.csv"$/,
    );
    const lines = res.text.split('\r\n');
    expect(lines[0]).toBe(HEADER);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(2);
    expect(parsed.data[0]).toMatchObject({
      name: 'Box squat, parallel box',
      equipment: 'box; bands',
      emphasis: 'bottom',
      lower_back_stress: '2',
      shoulder_stress: '0',
      specificity: '0.6',
      top_set: 'single',
      notes: 'Sit back, "pause", drive.\nKeep the shins vertical.',
      archived: 'no',
    });
    expect(parsed.data[1]).toMatchObject({ name: 'Rack pull, below knee', archived: 'yes' });
  });
});

describe('POST /api/variants/import', () => {
  it('adds new rows and updates rows whose name is in the library, reporting the counts', async () => {
    const { agent } = await freshCoach();
    const first = [
      HEADER,
      'Floor press,bench,floor press,straight,,lockout,1,2,1,0,0,0,1,0.3,single,,no',
      'Pin squat,squat,pin squat,straight,rack pins,bottom,0,0,0,2,2,2,2,0.7,triple,From a dead stop,no',
    ].join('\n');
    const a = await upload(agent, first);
    expect(a.status).toBe(200);
    expect(a.body).toEqual({ created: 2, updated: 0, unchanged: 0 });

    const second = [
      HEADER,
      // Same name in another case: updates the floor press (risk 1 → 2).
      'FLOOR PRESS,bench,floor press,straight,,lockout,1,2,1,0,0,0,2,0.3,single,,no',
      'Pin squat,squat,pin squat,straight,rack pins,bottom,0,0,0,2,2,2,2,0.7,triple,From a dead stop,no',
      'Block pull,deadlift,block pull,straight,blocks,lockout,0,0,0,2,1,0,2,0.8,single,,no',
    ].join('\r\n');
    const b = await upload(agent, second);
    expect(b.status).toBe(200);
    expect(b.body).toEqual({ created: 1, updated: 1, unchanged: 1 });
    const list = await agent.get('/api/variants');
    expect(list.body.total).toBe(3);
    expect(list.body.items.find((v: { family: string }) => v.family === 'floor press')).toMatchObject({
      name: 'FLOOR PRESS',
      risk: 2,
      version: 2,
    });
  });

  it('with one bad row answers 422 with the row, field and message, and writes nothing', async () => {
    const before = await exportOf(coach);
    const beforeList = (await coach.get('/api/variants?includeArchived=true')).body;
    const csv = [
      HEADER,
      'New variant A,squat,box squat,straight,box,bottom,0,0,0,1,1,1,1,0.5,single,,no',
      'New variant B,squat,box squat,straight,box,bottom,0,0,0,1,1,1,1,0.5,single,,no',
      // Edits an existing variant: must not stick either.
      'Box squat, parallel box,squat,box squat,straight,box,bottom,0,0,0,3,3,3,3,0.9,five,,no',
      'Bad one,squat,box squat,straight,box,sideways,0,0,0,1,1,1,1,0.5,single,,no',
    ]
      .join('\n')
      // The existing name contains a comma, so it travels quoted.
      .replace('Box squat, parallel box,squat', '"Box squat, parallel box",squat');
    const res = await upload(coach, csv);
    expect(res.status).toBe(422);
    expect(res.body.error).toEqual({
      code: 'invalid_rows',
      message: 'Nothing was imported: 1 row needs fixing.',
      rows: [{ row: 5, field: 'emphasis', message: 'Use bottom, mid-range or lockout' }],
    });
    expect(await exportOf(coach)).toBe(before);
    const afterList = (await coach.get('/api/variants?includeArchived=true')).body;
    expect(afterList).toEqual(beforeList);
  });

  it('lists every problem of every bad row, with the file’s row numbers', async () => {
    const csv = [
      HEADER,
      '"Two\nline note",squat,box squat,straight,box,bottom,0,0,0,1,1,1,1,0.5,single,"a\nb",no',
      ',bench,floor press,straight,,lockout,4,0,0,0,0,0,5,1.5,double,,maybe',
      '',
      'Same,squat,box squat,straight,box,bottom,0,0,0,1,1,1,1,0.5,single,,no',
      'same,squat,box squat,straight,box,bottom,0,0,0,1,1,1,1,0.5,single,,no',
    ].join('\n');
    const res = await upload(coach, csv);
    expect(res.status).toBe(422);
    const rows = res.body.error.rows as { row: number; field: string }[];
    expect(rows.filter((r) => r.row === 3).map((r) => r.field)).toEqual(
      expect.arrayContaining(['archived', 'name', 'shoulder_stress', 'risk', 'specificity', 'top_set']),
    );
    expect(rows).toContainEqual({ row: 6, field: 'name', message: 'The same name is already on row 5' });
    expect(rows.some((r) => r.row === 2)).toBe(false);
    expect(res.body.error.message).toBe('Nothing was imported: 2 rows need fixing.');
  });

  it('names missing and unknown columns on row 1', async () => {
    const res = await upload(coach, 'name,lift,colour\nX,squat,red\n');
    expect(res.status).toBe(422);
    const rows = res.body.error.rows as { row: number; field: string }[];
    expect(rows.filter((r) => r.row === 1).map((r) => r.field)).toEqual(
      expect.arrayContaining(['colour', 'family', 'bar', 'emphasis', 'risk', 'specificity']),
    );
  });

  it('reads files saved with semicolons, a byte-order mark, forgiving headers and optional columns', async () => {
    const { agent } = await freshCoach();
    const csv =
      '\uFEFFName;Lift;Family;Bar;Equipment;Emphasis;Lower back stress;Risk;Specificity\n' +
      'Good morning;squat;good morning;cambered;"cambered bar";Mid-range;3;3;0,25\n';
    const res = await upload(agent, csv);
    expect(res.status).toBe(200);
    const [v] = (await agent.get('/api/variants')).body.items;
    expect(v).toMatchObject({
      name: 'Good morning',
      equipment: ['cambered bar'],
      emphasis: 'midRange',
      stress: { lowerBack: 3 },
      specificity: 0.25,
      scheme: 'single',
      notes: null,
      archived: false,
    });
  });

  it('refuses a request without a file, and a file that is not text, with a field error', async () => {
    const none = await coach.post('/api/variants/import');
    expect(none.status).toBe(422);
    expect(none.body.error.fields).toHaveProperty('file');
    // The first bytes of a zip archive, which is what a spreadsheet's own format is.
    const zip = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00, 0x08, 0x00, ...Array(40).fill(0)]);
    const res = await upload(coach, zip, 'library.xlsx');
    expect(res.status).toBe(422);
    expect(res.body.error.fields.file[0]).toMatch(/not CSV text/);
  });

  it('refuses a file over 5 MB with 413 and a file under another field name with 422', async () => {
    const big = Buffer.alloc(5 * 1024 * 1024 + 1, 'a');
    const res = await upload(coach, big);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('file_too_large');
    const wrong = await coach.post('/api/variants/import').attach('csv', Buffer.from(HEADER), 'x.csv');
    expect(wrong.status).toBe(422);
  });

  it('lists each problem once, even for a file of random text', async () => {
    // A fixed seed, so the file is the same on every run.
    const rng = seedrandom('csv-noise');
    const alphabet = 'ab,,,""\n\r 1.;x';
    const noise = Array.from({ length: 6000 }, () => alphabet[Math.floor(rng() * alphabet.length)]).join('');
    const res = await upload(coach, `${HEADER}\n${noise}`);
    expect(res.status).toBe(422);
    const keys = res.body.error.rows.map((r: { row: number; field: string; message: string }) =>
      JSON.stringify([r.row, r.field, r.message]),
    );
    expect(keys.length).toBeGreaterThan(10);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('imports only into the caller’s team', async () => {
    const { fresh, agent } = await freshCoach();
    const before = await exportOf(coach);
    const res = await upload(
      agent,
      `${HEADER}\n"Box squat, parallel box",squat,box squat,straight,box,bottom,0,0,0,0,0,0,1,0.1,single,,no\n`,
    );
    expect(res.body).toEqual({ created: 1, updated: 0, unchanged: 0 });
    expect(await exportOf(coach)).toBe(before);
    expect(fresh.teamId).not.toBe(team.teamId);
  });

  it('keeps cells that look like spreadsheet formulas as text, both ways', async () => {
    const { agent } = await freshCoach();
    const made = await agent.post('/api/variants').send({
      name: '=SUM(A1:A2)',
      lift: 'bench',
      family: "+'board",
      bar: '@straight',
      equipment: ['-boards'],
      emphasis: 'lockout',
      stress: {},
      risk: 1,
      specificity: 0.5,
      scheme: 'single',
      notes: "''=already quoted",
    });
    expect(made.status).toBe(201);
    const csv = await exportOf(agent);
    const row = Papa.parse<Record<string, string>>(csv, { header: true, skipEmptyLines: true }).data[0]!;
    expect(row.name).toBe("'=SUM(A1:A2)");
    expect(row.equipment).toBe("'-boards");
    expect(row.notes).toBe("'''=already quoted");
    const { agent: other } = await freshCoach();
    expect((await upload(other, csv)).status).toBe(200);
    expect(await exportOf(other)).toBe(csv);
  });

  it('round-trips the demo library', async () => {
    const { agent } = await freshCoach();
    const csv = buildLibraryCsv(DEMO_LIBRARY.map((v) => ({ ...v, notes: v.notes ?? null, archived: false })));
    const res = await upload(agent, csv);
    expect(res.body).toEqual({ created: DEMO_LIBRARY.length, updated: 0, unchanged: 0 });
    expect(recordsOf(await exportOf(agent))).toEqual(recordsOf(csv));
  });
});

// ---------------------------------------------------------------------------------------------------
// Property: any valid library, written by the exporter and imported into a fresh team, comes back equal.

// Letters with accents, quotes, commas, semicolons (outside equipment), formula starters, newlines in notes.
const TEXT_CHARS = [...'abcdefghijklmnopqrstuvwxyzABCDEFGHIJ0123456789 ,"\'=+-@;()/%éüÅ'];
const ITEM_CHARS = TEXT_CHARS.filter((c) => c !== ';');
const text = (chars: string[], max: number) =>
  fc
    .string({ unit: fc.constantFrom(...chars), minLength: 1, maxLength: max })
    .map((s) => s.trim())
    .filter((s) => s.length > 0);

const variantArb = fc.record({
  name: text(TEXT_CHARS, 40),
  lift: fc.constantFrom('squat', 'bench', 'deadlift'),
  family: text(TEXT_CHARS, 20),
  bar: text(TEXT_CHARS, 15),
  equipment: fc.uniqueArray(text(ITEM_CHARS, 12), { maxLength: 4 }),
  emphasis: fc.constantFrom('bottom', 'midRange', 'lockout'),
  stress: fc.record(Object.fromEntries(JOINTS.map((j) => [j, fc.integer({ min: 0, max: 3 })]))),
  risk: fc.constantFrom(1, 2, 3),
  specificity: fc.integer({ min: 0, max: 100 }).map((n) => n / 100),
  scheme: fc.constantFrom('single', 'triple', 'five'),
  notes: fc.option(fc.string({ unit: fc.constantFrom(...TEXT_CHARS, '\n', '\r\n'), maxLength: 60 })),
  archived: fc.boolean(),
});

const libraryArb = fc.uniqueArray(variantArb, {
  minLength: 1,
  maxLength: 12,
  selector: (v) => nameKey(v.name),
});

describe('export → import round trip (property)', () => {
  it('gives back the same library for any valid one', async () => {
    await fc.assert(
      fc.asyncProperty(libraryArb, async (raw) => {
        // The canonical form the API would store (trimmed notes, zero stresses dropped…).
        const library = raw.map(({ archived, ...v }) => ({
          ...variantBody.parse(v as VariantBody),
          archived,
        }));
        const csv = buildLibraryCsv(library);
        const { agent } = await freshCoach();
        const res = await upload(agent, csv);
        expect(res.status, JSON.stringify(res.body)).toBe(200);
        expect(res.body.created).toBe(library.length);
        const stored = (await agent.get('/api/variants?includeArchived=true&limit=500')).body.items as Record<
          string,
          unknown
        >[];
        const strip = (v: Record<string, unknown>) => ({
          name: v.name,
          lift: v.lift,
          family: v.family,
          bar: v.bar,
          equipment: v.equipment,
          emphasis: v.emphasis,
          stress: v.stress,
          risk: v.risk,
          specificity: v.specificity,
          scheme: v.scheme,
          notes: v.notes,
          archived: v.archived,
        });
        const byName = (a: { name: unknown }, b: { name: unknown }) => String(a.name).localeCompare(String(b.name));
        expect(stored.map(strip).sort(byName)).toEqual(library.map(strip).sort(byName));
        // And the stored library exports to the same records.
        expect(recordsOf(await exportOf(agent))).toEqual(recordsOf(csv));
      }),
      { numRuns: 30, seed: Number(process.env.FC_SEED ?? Date.now() % 2 ** 31) },
    );
  });
});
