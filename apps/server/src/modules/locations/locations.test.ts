import { locationDetailSchema, locationSchema, pageSchema } from '@lotwise/shared';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, stockFactory } from '../../test/factories';
import { testContext } from '../../test/harness';

const app = () => testContext().app;
let manager = '';
let viewer = '';
const make = stockFactory(() => manager);

beforeAll(async () => {
  manager = (await signedIn('manager')).cookie;
  viewer = (await signedIn('viewer')).cookie;
});

const patch = (id: number, body: object) =>
  request(app()).patch(`/api/locations/${id}`).set('Cookie', manager).send(body);

describe('locations', () => {
  it('when a room, cabinet and shelf are created, then each has its path and depth', async () => {
    const room = await make.location({ name: 'Room 101', kind: 'room' });
    const cabinet = await make.location({ name: 'Cabinet A', parentId: room.id, kind: 'cabinet' });
    const shelf = await make.location({
      name: 'Shelf 2',
      parentId: cabinet.id,
      storageGroups: ['base'],
    });
    const detail = locationDetailSchema.parse(
      (await request(app()).get(`/api/locations/${shelf.id}`).set('Cookie', viewer).expect(200))
        .body,
    );
    expect(detail).toMatchObject({
      path: 'Room 101 › Cabinet A › Shelf 2',
      depth: 2,
      storageGroups: ['base'],
    });
    expect(detail.ancestors.map((a) => a.name)).toEqual(['Room 101', 'Cabinet A']);
    const list = pageSchema(locationSchema).parse(
      (await request(app()).get('/api/locations?q=cabinet a').set('Cookie', viewer).expect(200))
        .body,
    );
    expect(list.items.map((l) => l.path)).toEqual([
      'Room 101 › Cabinet A',
      'Room 101 › Cabinet A › Shelf 2',
    ]);
  });

  it('when a cabinet is renamed or moved, then every path below changes with it', async () => {
    const room = await make.location({ name: 'Room 202' });
    const other = await make.location({ name: 'Room 203' });
    const cabinet = await make.location({ name: 'Cabinet B', parentId: room.id });
    const shelf = await make.location({ name: 'Top', parentId: cabinet.id });
    await patch(cabinet.id, { name: 'Cabinet C', parentId: other.id }).expect(200);
    const moved = (await request(app()).get(`/api/locations/${shelf.id}`).set('Cookie', viewer))
      .body;
    expect(moved).toMatchObject({ path: 'Room 203 › Cabinet C › Top', depth: 2 });
  });

  it('when a place would move inside itself, then 409; a bad parent is 400', async () => {
    const room = await make.location({ name: 'Room 303' });
    const cabinet = await make.location({ name: 'Cab', parentId: room.id });
    const response = await patch(room.id, { parentId: cabinet.id }).expect(409);
    expect(response.body.error.fields.parentId).toBeTruthy();
    await patch(room.id, { parentId: room.id }).expect(409);
    await patch(room.id, { parentId: 987654 }).expect(400);
  });

  it('when a name is taken in the same parent, or bad, then it is refused', async () => {
    const room = await make.location({ name: 'Room 404' });
    await make.location({ name: 'Shelf', parentId: room.id });
    await request(app())
      .post('/api/locations')
      .set('Cookie', manager)
      .send({ name: 'shelf', parentId: room.id })
      .expect(409);
    const bad = await request(app())
      .post('/api/locations')
      .set('Cookie', manager)
      .send({ name: 'A › B', storageGroups: ['lava'] })
      .expect(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['name', 'storageGroups.0']);
    await request(app())
      .post('/api/locations')
      .set('Cookie', viewer)
      .send({ name: 'Nope' })
      .expect(403);
  });

  it('when a place holds a container or another place, then it cannot be deleted (409); empty, it can', async () => {
    const room = await make.location({ name: 'Room 505' });
    const shelf = await make.location({ name: 'S', parentId: room.id });
    const chemical = await make.chemical();
    const lot = await make.lot(chemical.id);
    await make.container(lot.id, shelf.id);
    const del = (id: number) =>
      request(app()).delete(`/api/locations/${id}`).set('Cookie', manager);
    expect((await del(room.id).expect(409)).body.error.message).toMatch(/other place/);
    expect((await del(shelf.id).expect(409)).body.error.message).toMatch(/1 container/);
    const spare = await make.location({ name: 'Spare' });
    await del(spare.id).expect(204);
    await del(spare.id).expect(404);
  });

  it("when a location's contents are listed, then containers in every place below are included", async () => {
    const room = await make.location({ name: 'Room 606' });
    const shelf = await make.location({ name: 'S1', parentId: room.id });
    const chemical = await make.chemical();
    const lot = await make.lot(chemical.id);
    const inRoom = await make.container(lot.id, room.id);
    const onShelf = await make.container(lot.id, shelf.id);
    const response = await request(app())
      .get(`/api/containers?locationId=${room.id}`)
      .set('Cookie', viewer)
      .expect(200);
    expect(response.body.items.map((c: { id: number }) => c.id).sort()).toEqual(
      [inRoom.id, onShelf.id].sort(),
    );
    const detail = (await request(app()).get(`/api/locations/${room.id}`).set('Cookie', viewer))
      .body;
    expect(detail).toMatchObject({ containerCount: 1, subtreeContainerCount: 2, childCount: 1 });
  });
});
