/**
 * Concurrency (issue: benchmarks, load, faults): two editors — the owner and a co-designer invited by
 * e-mail through the fake mail server — save the same pattern at the same moment, round after round.
 * Each round exactly one save wins; the other gets 409 with the latest revision (the winner's), then
 * saves its own work on top of it. Nothing is lost: every document either editor was told was saved is
 * stored under the number the server answered, and the revisions run 1…head without gaps.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient, signedInClient } from '../support/api-client';
import { gridDocument } from '../support/documents';
import { startServerProcess, type ServerProcess } from '../support/server-process';

const ROUNDS = 40;

let server: ServerProcess;
let owner: ApiClient;
let coDesigner: ApiClient;
let patternId: string;

beforeAll(async () => {
  server = await startServerProcess();
  ({ client: owner } = await signedInClient(server.baseUrl, 'designer', 'owner'));
  const second = await signedInClient(server.baseUrl, 'designer', 'partner');
  coDesigner = second.client;
  const created = await owner.post('/api/patterns', { document: gridDocument('Shared block r1', 3, 3, 4) });
  expect(created.status, created.text).toBe(201);
  patternId = created.json.pattern.id;

  // Invite the second designer as co-designer and accept through the link in the e-mail.
  const mail = server.mail.waitFor(second.credentials.email, 15_000);
  const invited = await owner.post(`/api/patterns/${patternId}/invitations`, { email: second.credentials.email, access: 'co-designer' });
  expect(invited.status, invited.text).toBe(201);
  const message = await mail;
  const token = /[?&]token=([^&\s"'<>]+)/.exec(message.text)?.[1];
  expect(token, message.text).toBeTruthy();
  const accepted = await coDesigner.post('/api/invitations/accept', { token: decodeURIComponent(token!) });
  expect(accepted.status, accepted.text).toBe(200);
});

afterAll(async () => {
  await server?.stop();
});

describe('two editors saving the same pattern', () => {
  it(`exactly one wins each of ${ROUNDS} rounds; the other gets 409 with the latest and loses nothing`, async () => {
    const saved = new Map<number, string>(); // revision number → title
    saved.set(1, 'Shared block r1');
    let head = 1;
    let ownerWins = 0;
    let partnerWins = 0;
    for (let round = 1; round <= ROUNDS; round++) {
      const titles = { owner: `Owner edit ${round}`, partner: `Partner edit ${round}` };
      const editors = [
        { name: 'owner' as const, client: owner },
        { name: 'partner' as const, client: coDesigner },
      ];
      // Alternate who sends first so both can win.
      if (round % 2 === 0) editors.reverse();
      const answers = await Promise.all(
        editors.map((e) =>
          e.client.put(`/api/patterns/${patternId}`, { baseRevision: head, document: gridDocument(titles[e.name], 3, 3, 4) }),
        ),
      );
      const statuses = answers.map((a) => a.status).sort();
      expect(statuses, answers.map((a) => a.text.slice(0, 200)).join('\n')).toEqual([200, 409]);
      const winIndex = answers.findIndex((a) => a.status === 200);
      const winner = editors[winIndex];
      const loser = editors[1 - winIndex];
      const won = answers[winIndex].json;
      const lost = answers[1 - winIndex].json;
      expect(won.revision.number).toBe(head + 1);
      expect(won.revision.document.title).toBe(titles[winner.name]);
      saved.set(won.revision.number, titles[winner.name]);
      if (winner.name === 'owner') ownerWins++;
      else partnerWins++;

      // The 409 carries the latest revision: the winner's, with its document.
      expect(lost.error).toMatch(/saved by someone else since revision/);
      expect(lost.details.latest.number).toBe(head + 1);
      expect(lost.details.latest.document.title).toBe(titles[winner.name]);

      // The loser keeps its work: it saves again on top of the latest revision.
      const retry = await loser.client.put(`/api/patterns/${patternId}`, {
        baseRevision: lost.details.latest.number,
        document: gridDocument(titles[loser.name], 3, 3, 4),
      });
      expect(retry.status, retry.text).toBe(200);
      expect(retry.json.revision.number).toBe(head + 2);
      saved.set(retry.json.revision.number, titles[loser.name]);
      head += 2;
    }
    console.log(`concurrency: ${ROUNDS} rounds, owner won ${ownerWins}, co-designer won ${partnerWins}, head ${head}`);
    expect(ownerWins + partnerWins).toBe(ROUNDS);

    // Nothing lost: every save either editor was told about is stored under its number.
    const pattern = await owner.get(`/api/patterns/${patternId}`);
    expect(pattern.json.pattern.headRevision).toBe(head);
    expect(pattern.json.revision.document.title).toBe(saved.get(head));
    const listed = await owner.get(`/api/patterns/${patternId}/revisions?pageSize=100`);
    expect(listed.json.total).toBe(head);
    expect(listed.json.items.map((r: { number: number }) => r.number)).toEqual(Array.from({ length: head }, (_, i) => head - i));
    for (const [number, title] of saved) {
      const res = await coDesigner.get(`/api/patterns/${patternId}/revisions/${number}`);
      expect(res.status).toBe(200);
      expect(res.json.revision.document.title).toBe(title);
    }
    // Authors are recorded: the revisions of both editors are there.
    const authors = new Set(listed.json.items.map((r: { author: { id: string } }) => r.author.id));
    expect(authors).toEqual(new Set([owner.user!.id, coDesigner.user!.id]));
  });

  it('many saves on one stale base: exactly one of 8 simultaneous saves wins', async () => {
    const current = await owner.get(`/api/patterns/${patternId}`);
    const base: number = current.json.pattern.headRevision;
    const answers = await Promise.all(
      Array.from({ length: 8 }, (_, i) =>
        (i % 2 ? coDesigner : owner).put(`/api/patterns/${patternId}`, { baseRevision: base, document: gridDocument(`Burst ${i}`, 3, 3, 4) }),
      ),
    );
    expect(answers.filter((a) => a.status === 200)).toHaveLength(1);
    expect(answers.filter((a) => a.status === 409)).toHaveLength(7);
    const winner = answers.find((a) => a.status === 200)!.json.revision;
    for (const a of answers.filter((x) => x.status === 409)) expect(a.json.details.latest.number).toBe(winner.number);
    const after = await owner.get(`/api/patterns/${patternId}`);
    expect(after.json.pattern.headRevision).toBe(base + 1);
    expect(after.json.revision.document.title).toBe(winner.document.title);
  });
});
