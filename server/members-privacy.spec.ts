/**
 * Who sees whom on a shared pattern (issue 15, item 7): buying a pattern makes the buyer a quilter
 * member, and buyers must not learn about each other. A buyer sees the owner's display name, their
 * own membership and their own print sets; e-mail addresses are shown only to the owner and
 * co-designers.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { membersAnswerSchema } from '@seamwright/api';
import { sharedPattern, startTestServer, userClient, type Client, type TestServer } from './test/harness';
import { storeFinishedPrintSet } from './test/stored-print-set';

let t: TestServer;
let owner: Client, co: Client, invited: Client, buyerA: Client, buyerB: Client;
let patternId: string;
const sets: Record<string, string> = {};

/** A paid shop order that granted quilter access, as the payment webhook stores it. */
async function buy(buyer: Client) {
  const { members, orders } = t.ctx.data.t;
  const now = new Date();
  await t.ctx.data.db.insert(members).values({ patternId, userId: buyer.user!.id, access: 'quilter', createdAt: now });
  await t.ctx.data.db.insert(orders).values({
    id: `ord${buyer.user!.id.slice(0, 10)}`,
    buyerId: buyer.user!.id,
    sellerId: owner.user!.id,
    patternId,
    patternTitle: 'Shop block',
    amountMinor: 1200,
    currency: 'usd',
    status: 'paid',
    grantedAccess: true,
    createdAt: now,
    paidAt: now,
  });
}

/** A finished print set made by `who`, stored as the renderer stores it. */
function printSetBy(who: Client): Promise<string> {
  return storeFinishedPrintSet(t, patternId, who.user!.id);
}

beforeAll(async () => {
  t = await startTestServer();
  owner = await userClient(t.app, 'owner@privacy.test', 'designer');
  co = await userClient(t.app, 'co@privacy.test', 'designer');
  invited = await userClient(t.app, 'invited@privacy.test', 'quilter');
  buyerA = await userClient(t.app, 'buyer-a@privacy.test', 'quilter');
  buyerB = await userClient(t.app, 'buyer-b@privacy.test', 'quilter');
  patternId = await sharedPattern(t, owner, [
    { client: co, access: 'co-designer' },
    { client: invited, access: 'quilter' },
  ]);
  await buy(buyerA);
  await buy(buyerB);
  for (const [name, c] of Object.entries({ owner, co, invited, buyerA, buyerB })) sets[name] = await printSetBy(c);
});
afterAll(async () => {
  await t.close();
});

describe("a shop buyer's view of a pattern", () => {
  it('members: the owner by display name and the buyer alone, no other buyer, no e-mail address', async () => {
    const res = await buyerA.get(`/api/patterns/${patternId}/members`).expect(200);
    expect(membersAnswerSchema.parse(res.body)).toEqual({
      owner: { id: owner.user!.id, displayName: 'owner' },
      members: [{ userId: buyerA.user!.id, displayName: 'buyer-a', access: 'quilter', createdAt: expect.any(String) }],
      invitations: [],
    });
    for (const secret of ['@privacy.test', buyerB.user!.id, 'buyer-b', co.user!.id, invited.user!.id]) expect(res.text).not.toContain(secret);
  });

  it('print sets: only their own in the list; another member’s set answers 404 to read, follow and download', async () => {
    const list = await buyerA.get(`/api/patterns/${patternId}/print-sets`).expect(200);
    expect(list.body.items.map((s: { id: string }) => s.id)).toEqual([sets['buyerA']]);
    for (const other of ['buyerB', 'owner', 'invited']) {
      await buyerA.get(`/api/patterns/${patternId}/print-sets/${sets[other]}`).expect(404);
      await buyerA.get(`/api/patterns/${patternId}/print-sets/${sets[other]}/file`).expect(404);
      await buyerA.get(`/api/patterns/${patternId}/print-sets/${sets[other]}/events`).expect(404);
      await buyerA.del(`/api/patterns/${patternId}/print-sets/${sets[other]}`).expect(404);
    }
    await buyerA.get(`/api/patterns/${patternId}/print-sets/${sets['buyerA']}/file`).expect(200);
  });
});

describe('e-mail addresses on the members view', () => {
  it('an invited quilter sees the other members by name, without any e-mail address', async () => {
    const res = await invited.get(`/api/patterns/${patternId}/members`).expect(200);
    const body = membersAnswerSchema.parse(res.body);
    expect(body.owner).toEqual({ id: owner.user!.id, displayName: 'owner' });
    expect(body.members.map((m) => m.displayName).sort()).toEqual(['buyer-a', 'buyer-b', 'co', 'invited']);
    expect(res.text).not.toContain('@privacy.test');
  });

  it('the owner and a co-designer see every address', async () => {
    for (const c of [owner, co]) {
      const body = membersAnswerSchema.parse((await c.get(`/api/patterns/${patternId}/members`).expect(200)).body);
      expect(body.owner.email).toBe('owner@privacy.test');
      expect(body.members.map((m) => m.email).sort()).toEqual(['buyer-a@privacy.test', 'buyer-b@privacy.test', 'co@privacy.test', 'invited@privacy.test']);
      const printSets = (await c.get(`/api/patterns/${patternId}/print-sets`).expect(200)).body.items;
      expect(printSets).toHaveLength(5);
    }
  });
});
