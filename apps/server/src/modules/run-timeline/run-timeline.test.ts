import {
  runPhotoMaxBytes,
  runPhotoSchema,
  runSchema,
  runTimelineSchema,
  timelineAppendResultSchema,
  type ProcedureStepInput,
  type RunTimeline,
  type TimelineEntryInput,
} from '@lotwise/shared';
import { randomUUID } from 'node:crypto';
import { readdir } from 'node:fs/promises';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn } from '../../test/factories';
import { alertRulesSettled, testContext } from '../../test/harness';
import { preparationFactory } from '../../test/preparations';
import { jpegBytes, tinyPdf, tinyPng } from '../../test/sample-files';
import { recordStatements } from '../../test/statements';
import { maxTimelineEntries } from './run-timeline.service';

const app = () => testContext().app;
const people = { manager: '', member: '', otherMember: '', viewer: '' };
const make = preparationFactory(() => people.manager);

beforeAll(async () => {
  people.manager = (await signedIn('manager')).cookie;
  people.member = (await signedIn('member')).cookie;
  people.otherMember = (await signedIn('member')).cookie;
  people.viewer = (await signedIn('viewer')).cookie;
});

/** Aspirin in three steps: add the anhydride at 5–7 °C, heat 15 min (hold point), cool. */
const steps: ProcedureStepInput[] = [
  {
    text: 'Add the acetic anhydride dropwise, keeping the mixture cool',
    temperatureLowC: 5,
    temperatureHighC: 7,
    outsideWindow: 'Slow the addition and add ice to the bath',
    lineIndex: 1,
    addition: 'dropwise over about 20 min',
    caution: 'exothermicAddition',
  },
  {
    text: 'Heat on the water bath',
    durationMinutes: 15,
    temperatureHighC: 90,
    holdPoint: 'all the solid has dissolved',
  },
  { text: 'Cool in ice and filter', durationMinutes: 30 },
];

async function openRunOfSteps(cookie = people.member, scaleFactor = 2) {
  const { procedure } = await make.aspirin({ steps });
  const response = await request(app())
    .post('/api/runs')
    .set('Cookie', cookie)
    .send({ procedureId: procedure.id, scaleFactor });
  if (response.status !== 201) throw new Error(JSON.stringify(response.body));
  return runSchema.parse(response.body);
}

const clientId = () => randomUUID();
const at = (minutes: number) =>
  new Date(Date.UTC(2026, 2, 2, 9, 0) + minutes * 60_000).toISOString();

function append(runId: number, entry: Partial<TimelineEntryInput>, cookie = people.member) {
  return request(app())
    .post(`/api/runs/${runId}/timeline`)
    .set('Cookie', cookie)
    .send({ clientId: clientId(), kind: 'note', at: at(0), ...entry });
}

async function appended(runId: number, entry: Partial<TimelineEntryInput>, cookie?: string) {
  const response = await append(runId, entry, cookie);
  if (response.status !== 201) throw new Error(JSON.stringify(response.body));
  return timelineAppendResultSchema.parse(response.body).entry;
}

async function timelineOf(runId: number, cookie = people.member): Promise<RunTimeline> {
  const response = await request(app())
    .get(`/api/runs/${runId}/timeline`)
    .set('Cookie', cookie)
    .expect(200);
  return runTimelineSchema.parse(response.body);
}

describe('appending to a run timeline', () => {
  it('when the same client id is sent twice, then it is stored once and the resend answers the stored entry with 200', async () => {
    const run = await openRunOfSteps();
    const entry = { clientId: clientId(), kind: 'note' as const, text: 'Bath at 5 °C', at: at(1) };
    const first = await append(run.id, entry).expect(201);
    const again = await append(run.id, { ...entry, text: 'changed on resend' }).expect(200);
    expect(again.body).toEqual({ ...first.body, created: false });
    expect(first.body.created).toBe(true);
    const timeline = await timelineOf(run.id);
    expect(timeline.entries.map((e) => e.text)).toEqual(['Bath at 5 °C']);
  });

  it('when two posts of the same client id arrive at the same moment, then one is stored and both answer it', async () => {
    const run = await openRunOfSteps();
    const entry = { clientId: clientId(), kind: 'reading' as const, temperatureC: 6, at: at(2) };
    const [a, b] = await Promise.all([append(run.id, entry), append(run.id, entry)]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body.entry.id).toBe(b.body.entry.id);
    expect((await timelineOf(run.id)).entries).toHaveLength(1);
  });

  it('when readings arrive out of order, then the timeline orders them by the time they were taken', async () => {
    const run = await openRunOfSteps();
    await appended(run.id, { kind: 'step-start', stepIndex: 0, at: at(0) });
    await appended(run.id, { kind: 'reading', temperatureC: 6.5, at: at(10) });
    await appended(run.id, { kind: 'reading', temperatureC: 5.5, at: at(5) });
    const timeline = await timelineOf(run.id);
    expect(timeline.entries.map((e) => [e.kind, e.at])).toEqual([
      ['step-start', at(0)],
      ['reading', at(5)],
      ['reading', at(10)],
    ]);
    // A reading without a step belongs to the step under way when it was taken.
    expect(timeline.entries.filter((e) => e.kind === 'reading').map((e) => e.stepIndex)).toEqual([
      0, 0,
    ]);
    expect(timeline.currentStepIndex).toBe(0);
  });

  it('when a reading falls outside its step window, then it is flagged with the window and the step instruction', async () => {
    const run = await openRunOfSteps();
    await appended(run.id, { kind: 'step-start', stepIndex: 0, at: at(0) });
    const inside = await appended(run.id, { kind: 'reading', temperatureC: 7, at: at(3) });
    expect(inside.deviation).toBeNull();
    const outside = await appended(run.id, { kind: 'reading', temperatureC: 9.5, at: at(4) });
    // 9.5 °C against 5–7 °C: 2.5 °C above. // common practice, no source
    expect(outside.deviation).toEqual({
      reason: 'reading-outside-window',
      stepIndex: 0,
      message: '9.5 °C is 2.5 °C above the window of step 1 (5–7 °C)',
      instruction: 'Slow the addition and add ice to the bath',
    });
    const timeline = await timelineOf(run.id);
    expect(timeline.deviations).toEqual([
      { entryId: outside.id, at: at(4), deviation: outside.deviation },
    ]);
    const read = runSchema.parse(
      (await request(app()).get(`/api/runs/${run.id}`).set('Cookie', people.member).expect(200))
        .body,
    );
    expect(read.deviationCount).toBe(1);
  });

  it('when a step is ended before its time and a hold point is passed, then both are flagged', async () => {
    const run = await openRunOfSteps();
    await appended(run.id, { kind: 'step-start', stepIndex: 1, at: at(0) });
    const ended = await appended(run.id, { kind: 'step-end', stepIndex: 1, at: at(10) });
    expect(ended.deviation).toMatchObject({
      reason: 'step-ended-early',
      stepIndex: 1,
      message: 'step 2 was ended after 10 min of its 15 min',
      instruction: '',
    });
    await appended(run.id, { kind: 'step-start', stepIndex: 2, at: at(11) });
    let timeline = await timelineOf(run.id);
    expect(timeline.deviations.map((d) => d.deviation.reason)).toEqual(['step-ended-early']);
    expect(timeline.steps[1]).toMatchObject({ startedAt: at(0), endedAt: at(10) });
    expect(timeline.currentStepIndex).toBe(2);

    // Step 2 started and never ended: step 3 passes its hold point.
    const other = await openRunOfSteps();
    await appended(other.id, { kind: 'step-start', stepIndex: 1, at: at(0) });
    const skipped = await appended(other.id, { kind: 'step-start', stepIndex: 2, at: at(20) });
    expect(skipped.deviation).toMatchObject({ reason: 'hold-point-skipped', stepIndex: 1 });
    expect(skipped.deviation!.message).toContain('all the solid has dissolved');
    timeline = await timelineOf(other.id);
    expect(timeline.deviations.map((d) => d.deviation.reason)).toEqual(['hold-point-skipped']);
  });

  it('when a timer is started, then its end time is stored, and a timer-end stops it', async () => {
    const run = await openRunOfSteps();
    const timer = await appended(run.id, { kind: 'timer-start', stepIndex: 2, at: at(0) });
    expect(timer).toMatchObject({ durationMinutes: 30, endsAt: at(30) });
    const own = await appended(run.id, { kind: 'timer-start', durationMinutes: 5, at: at(1) });
    expect(own).toMatchObject({ durationMinutes: 5, endsAt: at(6), stepIndex: null });
    let timeline = await timelineOf(run.id);
    // Soonest end first.
    expect(timeline.runningTimers.map((t) => t.id)).toEqual([own.id, timer.id]);

    const stop = await appended(run.id, { kind: 'timer-end', stepIndex: 2, at: at(31) });
    expect(stop).toMatchObject({ timerClientId: timer.clientId, deviation: null });
    const stopOwn = await appended(run.id, {
      kind: 'timer-end',
      timerClientId: own.clientId,
      at: at(3),
    });
    expect(stopOwn.timerClientId).toBe(own.clientId);
    timeline = await timelineOf(run.id);
    expect(timeline.runningTimers).toEqual([]);

    await append(run.id, { kind: 'timer-end', at: at(40) }).expect(400);
    const noTime = await append(run.id, { kind: 'timer-start', stepIndex: 0, at: at(0) });
    expect(noTime.status).toBe(400);
    expect(noTime.body.error.fields).toHaveProperty('durationMinutes');
  });

  it('when a timer is stopped before the step time, then it is flagged', async () => {
    const run = await openRunOfSteps();
    await appended(run.id, { kind: 'timer-start', stepIndex: 1, at: at(0) });
    const stop = await appended(run.id, { kind: 'timer-end', stepIndex: 1, at: at(5) });
    expect(stop.deviation).toMatchObject({
      reason: 'timer-ended-early',
      stepIndex: 1,
      message: 'the timer of step 2 was stopped after 5 min of its 15 min',
    });
    // A shorter timer of its own inside the step, stopped when it rang: no deviation.
    const short = await appended(run.id, {
      kind: 'timer-start',
      stepIndex: 1,
      durationMinutes: 3,
      at: at(6),
    });
    const rang = await appended(run.id, {
      kind: 'timer-end',
      timerClientId: short.clientId,
      at: at(9),
    });
    expect(rang).toMatchObject({ stepIndex: 1, deviation: null });
  });

  it('when the time carries an offset, then it is kept in UTC, and a recorded run still takes late entries', async () => {
    const run = await openRunOfSteps(people.manager);
    const entry = await appended(
      run.id,
      { kind: 'note', text: 'Sent from the bench', at: '2026-03-02T10:15:00+01:00' },
      people.manager,
    );
    expect(entry.at).toBe('2026-03-02T09:15:00.000Z');
    expect(entry.recordedBy).not.toBeNull();
    await testContext().dataSource.query(
      `UPDATE runs SET status = 'recorded' WHERE id = ${run.id}`,
    );
    // Entered offline before the run was recorded, sent after: kept.
    await appended(run.id, { kind: 'reading', temperatureC: 21, at: at(30) }, people.manager);
    const timeline = await timelineOf(run.id);
    expect(timeline.status).toBe('recorded');
    expect(timeline.entries).toHaveLength(2);
  });

  it('when a run holds the most entries it keeps, then one more is refused (409) saying so', async () => {
    const run = await openRunOfSteps();
    const { dataSource } = testContext();
    const values = Array.from(
      { length: maxTimelineEntries - 1 },
      (_, i) => `(${run.id}, 'bulk-${i}-entry', 'note', '${at(i)}', 'n', '${at(i)}')`,
    );
    await dataSource.query(
      `INSERT INTO run_timeline_entries (run_id, client_id, kind, at, text, received_at) VALUES ${values.join(', ')}`,
    );
    await appended(run.id, { text: 'the last one' });
    const refused = await append(run.id, { text: 'one too many' }).expect(409);
    expect(refused.body.error.message).toMatch(/already has 2000 timeline entries/);
  });

  it('when the step is not one of the procedure, then it is refused naming the steps', async () => {
    const run = await openRunOfSteps();
    const response = await append(run.id, { kind: 'step-start', stepIndex: 3 }).expect(400);
    expect(response.body.error.fields.stepIndex).toMatch(/has 3 steps/);
  });

  it('when someone else runs it, then a member may not add to it (403) but a manager may', async () => {
    const run = await openRunOfSteps(people.member);
    await append(run.id, { text: 'not mine' }, people.otherMember).expect(403);
    await append(run.id, { text: 'a manager helps' }, people.manager).expect(201);
  });

  it('when a viewer looks, then the timeline reads but takes no entries', async () => {
    const run = await openRunOfSteps();
    await appended(run.id, { kind: 'reading', temperatureC: 20, at: at(1) });
    await append(run.id, { text: 'a viewer' }, people.viewer).expect(403);
    const timeline = await timelineOf(run.id, people.viewer);
    expect(timeline.entries).toHaveLength(1);
  });

  it('when the timeline is read, then each step shows its window and its addition at the run scale', async () => {
    const run = await openRunOfSteps(people.member, 2);
    const timeline = await timelineOf(run.id);
    expect(timeline.status).toBe('open');
    expect(timeline.steps.map((s) => s.windowText)).toEqual(['5–7 °C', 'at most 90 °C', null]);
    // 5.0 mL acetic anhydride at twice the scale. // common practice, no source
    expect(timeline.steps[0]).toMatchObject({
      additionAmount: '10.0 mL',
      addition: 'dropwise over about 20 min',
    });
    expect(timeline.steps[0]!.additionChemical).toMatch(/^Acetic anhydride/);
    expect(timeline.steps[1]!.additionAmount).toBeNull();
  });

  it('when a run has more entries, then reading its timeline sends no more statements', async () => {
    const run = await openRunOfSteps();
    await appended(run.id, { kind: 'step-start', stepIndex: 0, at: at(0) });
    const count = async () => {
      await alertRulesSettled();
      const recording = await recordStatements(testContext().dataSource);
      await timelineOf(run.id);
      return recording.stop().length;
    };
    const before = await count();
    for (let i = 1; i <= 12; i++) {
      await appended(run.id, { kind: 'reading', temperatureC: 5 + (i % 4), at: at(i) });
    }
    await appended(run.id, { kind: 'note', text: 'from a manager', at: at(20) }, people.manager);
    const after = await count();
    expect(after).toBe(before);
  });
});

describe('photos of a run', () => {
  const upload = (
    runId: number,
    file: Buffer,
    name: string,
    id = clientId(),
    cookie = people.member,
  ) =>
    request(app())
      .post(`/api/runs/${runId}/photos`)
      .set('Cookie', cookie)
      .field('clientId', id)
      .attach('file', file, name);

  it('when a PNG is uploaded twice with the same client id, then it is stored once and can be fetched and put on the timeline', async () => {
    const run = await openRunOfSteps();
    const id = clientId();
    const before = await readdir(testContext().config.uploadDir).catch(() => []);
    const first = await upload(run.id, tinyPng(), 'bench.png', id).expect(201);
    const photo = runPhotoSchema.parse(first.body);
    expect(photo).toMatchObject({ contentType: 'image/png', fileName: 'bench.png', runId: run.id });
    const again = await upload(run.id, tinyPng(), 'bench.png', id).expect(200);
    expect(again.body).toEqual(first.body);
    const after = await readdir(testContext().config.uploadDir);
    expect(after.filter((name) => !name.startsWith('.')).length).toBe(
      before.filter((name) => !name.startsWith('.')).length + 1,
    );
    const incoming = await readdir(`${testContext().config.uploadDir}/.incoming`).catch(() => []);
    expect(incoming).toEqual([]);

    const fetched = await request(app())
      .get(photo.url)
      .set('Cookie', people.viewer)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(fetched.headers['content-type']).toBe('image/png');
    // Shown in the browser when its link is opened, not downloaded.
    expect(fetched.headers['content-disposition']).toMatch(/^inline; filename="?bench\.png/);
    expect(Buffer.compare(fetched.body as Buffer, tinyPng())).toBe(0);

    // The same photo sent twice at the same moment: kept once, the other copy removed.
    const twiceId = clientId();
    const twice = await Promise.all([
      upload(run.id, tinyPng(), 'again.png', twiceId),
      upload(run.id, tinyPng(), 'again.png', twiceId),
    ]);
    expect(twice.map((r) => r.status).sort()).toEqual([200, 201]);
    expect(twice[0]!.body.uploadId).toBe(twice[1]!.body.uploadId);
    const kept = await readdir(testContext().config.uploadDir);
    expect(kept.filter((name) => !name.startsWith('.')).length).toBe(
      before.filter((name) => !name.startsWith('.')).length + 2,
    );

    const entry = await appended(run.id, {
      kind: 'photo',
      uploadId: photo.uploadId,
      text: 'Crystals',
    });
    expect(entry.photoUrl).toBe(photo.url);
  });

  it('when a WebP is uploaded, then it is kept as one; without a client id or a file it is refused', async () => {
    const run = await openRunOfSteps();
    // RIFF container, WEBP form, a lossless (VP8L) chunk: what file-type reads. // from memory
    const webp = Buffer.concat([
      Buffer.from('RIFF'),
      Buffer.from([26, 0, 0, 0]),
      Buffer.from('WEBPVP8L'),
      Buffer.from([13, 0, 0, 0, 0x2f, 0, 0, 0, 0, 0x07, 0, 0, 0, 0, 0, 0, 0, 0]),
    ]);
    const kept = await upload(run.id, webp, 'dish').expect(201);
    expect(kept.body).toMatchObject({ contentType: 'image/webp', fileName: 'dish.webp' });
    const noId = await request(app())
      .post(`/api/runs/${run.id}/photos`)
      .set('Cookie', people.member)
      .attach('file', tinyPng(), 'a.png')
      .expect(400);
    expect(noId.body.error.fields.clientId).toBe('is required');
    await request(app())
      .post(`/api/runs/${run.id}/photos`)
      .set('Cookie', people.member)
      .send({ clientId: clientId() })
      .expect(415);
  });

  it('when the file is not an image, then it is refused naming the types allowed', async () => {
    const run = await openRunOfSteps();
    const pdf = await upload(run.id, tinyPdf(), 'photo.jpg');
    expect(pdf.status).toBe(415);
    expect(pdf.body.error.message).toMatch(/JPEG, PNG or WebP/);
    const text = await upload(run.id, Buffer.from('just some words, not a picture'), 'photo.jpg');
    expect(text.status).toBe(415);
    expect(text.body.error.message).toMatch(/must be a JPEG, PNG or WebP file/);
    const incoming = await readdir(`${testContext().config.uploadDir}/.incoming`).catch(() => []);
    expect(incoming).toEqual([]);
  });

  it('when the photo is larger than the limit, then it is refused (413)', async () => {
    const run = await openRunOfSteps();
    const big = Buffer.concat([jpegBytes(), Buffer.alloc(runPhotoMaxBytes + 1)]);
    const response = await upload(run.id, big, 'huge.jpg');
    expect(response.status).toBe(413);
    expect(response.body.error.message).toMatch(/12 MB/);
  });

  it("when an entry names another run's photo, then it is refused", async () => {
    const run = await openRunOfSteps();
    const other = await openRunOfSteps();
    const photo = runPhotoSchema.parse(
      (await upload(other.id, tinyPng(), 'a.png').expect(201)).body,
    );
    const response = await append(run.id, { kind: 'photo', uploadId: photo.uploadId }).expect(400);
    expect(response.body.error.fields.uploadId).toMatch(/not a photo of run/);
    await request(app())
      .get(`/api/runs/${run.id}/photos/${photo.uploadId}`)
      .set('Cookie', people.member)
      .expect(404);
  });

  it("when a member uploads to another member's run, then it is refused (403)", async () => {
    const run = await openRunOfSteps(people.member);
    await upload(run.id, tinyPng(), 'a.png', clientId(), people.otherMember).expect(403);
  });

  it('when an opened run is discarded, then its timeline and photos go with it, files too', async () => {
    const run = await openRunOfSteps();
    const photo = runPhotoSchema.parse((await upload(run.id, tinyPng(), 'a.png').expect(201)).body);
    await appended(run.id, { kind: 'photo', uploadId: photo.uploadId });
    await appended(run.id, { kind: 'reading', temperatureC: 6 });
    const files = await readdir(testContext().config.uploadDir);
    await request(app()).delete(`/api/runs/${run.id}`).set('Cookie', people.member).expect(204);
    const left = await readdir(testContext().config.uploadDir);
    expect(left.length).toBe(files.length - 1);
    const [row] = await testContext().dataSource.query(
      `SELECT (SELECT COUNT(*) FROM run_timeline_entries WHERE run_id = ${run.id}) AS entries, (SELECT COUNT(*) FROM run_photos WHERE run_id = ${run.id}) AS photos`,
    );
    expect(Number(row.entries) + Number(row.photos)).toBe(0);
  });
});
